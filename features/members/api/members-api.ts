import { apiFetch } from '@/lib/api/client';
import type { Member } from '@/lib/members/types';
import type { InviteInput, MemberUpdate } from '@/lib/members/schemas';

/** Cache keys for the member list. */
export const memberKeys = {
  all: ['members'] as const,
};

/** GET /api/members: members and open invitations. */
export async function fetchMembers(): Promise<Member[]> {
  const { members } = await apiFetch<{ members: Member[] }>('/api/members');
  return members;
}

/** POST /api/members: invite by e-mail. */
export async function postInvitation(input: InviteInput): Promise<{ id: string }> {
  const { invitation } = await apiFetch<{ invitation: { id: string } }>('/api/members', {
    method: 'POST',
    body: input,
  });
  return invitation;
}

/** PATCH /api/members/:userId: a new role, or deactivate / reactivate. */
export async function patchMember(userId: string, input: MemberUpdate): Promise<Member> {
  const url = `/api/members/${encodeURIComponent(userId)}`;
  const { member } = await apiFetch<{ member: Member }>(url, {
    method: 'PATCH',
    body: input,
  });
  return member;
}

/** POST /api/invitations/accept: public; the token is the credential. */
export async function acceptInvitation(token: string, password: string): Promise<{ email: string }> {
  return apiFetch<{ email: string }>('/api/invitations/accept', {
    method: 'POST',
    body: { token, password },
  });
}
