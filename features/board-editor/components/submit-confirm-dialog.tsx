'use client';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { countWays, countWords } from '@/lib/boards/counts';

import { useDraftSizing } from '../hooks/use-live-sizing';
import { useBoardDraftStore } from '../stores/board-draft-store';

type Props = { open: boolean; revision: number; onClose: () => void; onConfirm: () => void };

/**
 * "Send for review" asks first: what goes (the board, its revision, its ways as last sized)
 * and what follows (the inspectors are e-mailed, the board is locked until it comes back).
 */
export function SubmitConfirmDialog({ open, revision, onClose, onConfirm }: Props) {
  const name = useBoardDraftStore((s) => s.settings?.name ?? 'this board');
  const ways = useBoardDraftStore((s) => s.ways);
  const phases = useBoardDraftStore((s) => s.settings?.phases ?? 1);
  const dirty = useBoardDraftStore((s) => s.dirty);
  const counts = useDraftSizing((s) => s.result.summary.counts);
  return (
    <ConfirmDialog
      open={open}
      danger={false}
      title={`Send ${name} for review?`}
      cancelLabel="Not yet"
      confirmLabel="Send for review"
      onClose={onClose}
      onConfirm={onConfirm}
    >
      <div className="space-y-2">
        <p>
          {/* The ways counted by way number, in the words of the boards list and the schedule */}
          Revision {revision}: {countWords(countWays(phases, ways))}
          {counts ? ` (${counts.passes} pass, ${counts.nearLimit} near the limit, ${counts.fails} fail)` : ''}.
        </p>
        {dirty ? <p>Your unsaved changes are saved first.</p> : null}
        <p>
          The inspectors are e-mailed, and the board cannot be changed until one of them issues it or returns it to you.
        </p>
      </div>
    </ConfirmDialog>
  );
}
