'use client';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
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
    <Dialog open={open} onClose={onClose} title={`Send ${name} for review?`}>
      <div className="space-y-2 text-sm leading-relaxed text-ink">
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
      <DialogActions>
        <Button variant="secondary" onClick={onClose}>
          Not yet
        </Button>
        <Button onClick={onConfirm}>Send for review</Button>
      </DialogActions>
    </Dialog>
  );
}
