'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';

import type { SiteInput } from '@/lib/sites/schemas';

import { patchSite, postSite, removeSite, restoreSite, siteKeys } from './sites-api';

/** Creates a site and refreshes every site list. */
export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SiteInput) => postSite(input),
    onSuccess: (site) => {
      queryClient.setQueryData(siteKeys.detail(site.id), site);
      return queryClient.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}

/** Renames a site or edits its client and address. */
export function useUpdateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ siteId, input }: { siteId: string; input: Partial<SiteInput> }) => patchSite(siteId, input),
    onSuccess: (site) => {
      queryClient.setQueryData(siteKeys.detail(site.id), site);
      // Board lists show the site's name, so they are refreshed too
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: siteKeys.all }),
        queryClient.invalidateQueries({ queryKey: ['boards'] }),
      ]);
    },
  });
}

/** Deletes a site with its boards. */
export function useDeleteSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (siteId: string) => removeSite(siteId),
    onSuccess: (_data, siteId) => {
      queryClient.removeQueries({ queryKey: siteKeys.detail(siteId) });
      // The archived site's own page may still be open: refresh the lists, not its detail
      return Promise.all([
        queryClient.invalidateQueries({
          queryKey: siteKeys.all,
          predicate: (query) => query.queryKey[1] !== 'detail',
        }),
        // Board lists reload when next shown; the open page's own list would only 404 now
        queryClient.invalidateQueries({ queryKey: ['boards'], refetchType: 'none' }),
      ]);
    },
  });
}

/** Brings an archived site and its boards back into the lists (admins). */
export function useRestoreSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (siteId: string) => restoreSite(siteId),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: siteKeys.all }),
        queryClient.invalidateQueries({ queryKey: ['boards'] }),
      ]),
  });
}
