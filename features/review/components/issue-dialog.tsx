'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { ApiError, errorMessage } from '@/lib/api/client';
import type { BoardDto } from '@/lib/boards/types';
import type { IssuePreview } from '@/lib/boards/review-types';
import { plural } from '@/lib/names';

import { postApprove } from '../api/review-api';

type Props = {
  open: boolean;
  onClose: () => void;
  board: Pick<BoardDto, 'id' | 'name' | 'siteName' | 'location'>;
  issue: IssuePreview;
};

/**
 * The confirmation before a board is issued: what is issued (board, revision, how many ways
 * and how they size up), and the issuer's name typed as their declaration. A board with failing
 * ways needs one more tick.
 */
export function IssueDialog({ open, onClose, board, issue }: Props) {
  const router = useRouter();
  const [name, setName] = useState('');
  const [acknowledge, setAcknowledge] = useState(false);
  const { passes, nearLimit, fails } = issue.verdicts;
  const approve = useMutation({
    mutationFn: () =>
      postApprove(board.id, {
        declaration: name,
        revision: issue.revision,
        ...(fails > 0 ? { acknowledgeFailures: acknowledge } : {}),
      }),
    onSuccess: (r) => {
      toast.success(`Issued as revision ${r.revision}. The designer has been e-mailed.`);
      onClose();
      router.refresh();
    },
  });
  const nameIssue =
    approve.error instanceof ApiError ? approve.error.issues.find((i) => i.path === 'declaration')?.message : undefined;
  const blocked = !name.trim() || (fails > 0 && !acknowledge) || approve.isPending;
  return (
    <Dialog open={open} onClose={onClose} title={`Issue ${board.name}?`}>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" aria-label="What is issued">
        <dt className="text-ink-soft">Board</dt>
        <dd className="font-medium text-ink">
          {board.name} · {board.siteName}
          {board.location ? ` · ${board.location}` : ''}
        </dd>
        <dt className="text-ink-soft">Issued as</dt>
        <dd className="font-medium text-ink">revision {issue.revision}</dd>
        <dt className="text-ink-soft">Ways</dt>
        <dd className="text-ink">{issue.ways}</dd>
        <dt className="text-ink-soft">Verdicts</dt>
        <dd className="text-ink">
          {passes} pass · {nearLimit} near the limit · {fails} fail
        </dd>
      </dl>
      {fails > 0 ? (
        <label className="mt-3 flex items-start gap-2 rounded-md border border-verdict-fail/30 bg-verdict-fail-bg px-3 py-2 text-sm text-ink">
          <input
            type="checkbox"
            checked={acknowledge}
            onChange={(e) => setAcknowledge(e.target.checked)}
            className="mt-1"
          />
          {plural(fails, 'way fails', 'ways fail')} a check. I issue the board as it is.
        </label>
      ) : null}
      <p className="mt-4 text-sm leading-relaxed text-ink">
        By typing your name you declare that you have reviewed this design and issue it as revision {issue.revision}.
        Your name is recorded with the revision and in the audit trail.
      </p>
      <label className="mt-2 block text-sm font-medium text-ink">
        Your full name
        <input
          value={name}
          onChange={(e) => setName(e.target.value)}
          autoComplete="off"
          aria-invalid={!!nameIssue}
          className="mt-1 w-full rounded-md border border-line-strong bg-paper px-3 py-2 text-sm focus:border-copper focus:outline-none"
        />
      </label>
      {nameIssue ? <p className="mt-1 text-xs font-medium text-verdict-fail">{nameIssue}</p> : null}
      {approve.isError && !nameIssue ? <FormAlert className="mt-3">{errorMessage(approve.error)}</FormAlert> : null}
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={approve.isPending}>
          Not yet
        </Button>
        <Button onClick={() => approve.mutate()} disabled={blocked}>
          {approve.isPending ? 'Issuing…' : `Issue revision ${issue.revision}`}
        </Button>
      </DialogActions>
    </Dialog>
  );
}
