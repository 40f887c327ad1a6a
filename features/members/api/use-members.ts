'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { InviteInput, MemberUpdate } from '@/lib/members/schemas';

import { fetchMembers, memberKeys, patchMember, postInvitation } from './members-api';

/** Members of the organisation and invitations not yet taken up. */
export function useMembers() {
  return useQuery({ queryKey: memberKeys.all, queryFn: fetchMembers });
}

/** Sends an invitation and refreshes the list. */
export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => postInvitation(input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.all }),
  });
}

/** Changes a member's role or active flag and refreshes the list. */
export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, input }: { userId: string; input: MemberUpdate }) => patchMember(userId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.all }),
  });
}
