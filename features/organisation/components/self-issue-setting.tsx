'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { toast } from 'sonner';

import { FormAlert } from '@/components/ui/form-alert';
import { apiFetch, errorMessage } from '@/lib/api/client';
import type { OrganisationSettings } from '@/lib/organisation/schemas';

/**
 * Whether the person who last changed a design may issue it too. Off by default: someone
 * else issues every board. One-person firms turn it on.
 */
export function SelfIssueSetting({ initial }: { initial: OrganisationSettings }) {
  const [allowed, setAllowed] = useState(initial.allowSelfIssue);
  const change = useMutation({
    mutationFn: (allowSelfIssue: boolean) =>
      apiFetch<{ organisation: OrganisationSettings }>('/api/organisation', {
        method: 'PATCH',
        body: { allowSelfIssue },
      }),
    onSuccess: ({ organisation }) => {
      setAllowed(organisation.allowSelfIssue);
      toast.success(
        organisation.allowSelfIssue
          ? 'The last person to change a design may now issue it too.'
          : 'Boards are now issued by someone other than their last designer.',
      );
    },
  });
  return (
    <section aria-labelledby="issuing-heading" className="mt-8 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="issuing-heading" className="text-base font-semibold text-ink">
        Issuing boards
      </h2>
      <label className="mt-2 flex items-start gap-2 text-sm text-ink">
        <input
          type="checkbox"
          className="mt-1"
          checked={allowed}
          disabled={change.isPending}
          onChange={(e) => change.mutate(e.target.checked)}
        />
        <span>
          Let the person who last changed a design issue it themselves (for one-person firms). When this is off, a board
          is issued by someone else, admins included.
        </span>
      </label>
      {change.isError ? <FormAlert className="mt-3">{errorMessage(change.error)}</FormAlert> : null}
    </section>
  );
}
