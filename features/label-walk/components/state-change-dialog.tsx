'use client';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';

type Props = {
  /** The result about to be recorded, or null when nothing is asked. */
  status: 'wrong' | 'missing' | null;
  wayName: string;
  revision: number;
  onConfirm: () => void;
  onClose: () => void;
};

/**
 * Asked before a label check takes a fully confirmed board back: every label matched, so the
 * board's labels matched on site; recording a wrong or missing label makes it issued again.
 */
export function StateChangeDialog({ status, wayName, revision, onConfirm, onClose }: Props) {
  return (
    <Dialog open={status !== null} onClose={onClose} title="This changes the board’s state">
      <div className="space-y-2 text-sm leading-relaxed text-ink">
        <p>
          Every label on this board was confirmed, so revision {revision} stands as labels matched on site. Recording
          the label of {wayName} as <strong>{status === 'missing' ? 'missing' : 'wrong'}</strong> takes the board back
          to issued until the label is put right and checked again.
        </p>
        <p>The designer sees the label problem on the board page.</p>
      </div>
      <DialogActions>
        <Button variant="secondary" onClick={onClose}>
          Keep the labels matched
        </Button>
        <Button variant="danger" onClick={onConfirm}>
          Record it and change the state
        </Button>
      </DialogActions>
    </Dialog>
  );
}
