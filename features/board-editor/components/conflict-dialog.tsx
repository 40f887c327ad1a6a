'use client';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';

type ConflictDialogProps = {
  open: boolean;
  message: string | null;
  onReloadTheirs: () => void;
  onKeepMine: () => void;
  onClose: () => void;
};

/**
 * Someone else saved the board after this draft was started. Neither copy is lost without the
 * designer choosing: "Reload theirs" drops this draft, "Keep mine" saves it on top of theirs.
 */
export function ConflictDialog({ open, message, onReloadTheirs, onKeepMine, onClose }: ConflictDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="This board was saved elsewhere"
      description={message ?? 'Someone else saved this board after you started these changes.'}
    >
      <div className="space-y-2 text-sm text-ink">
        <p>
          <strong>Reload theirs</strong> opens the board as it is saved now; the changes made here are dropped.
        </p>
        <p>
          <strong>Keep mine</strong> saves this copy over theirs; their changes are replaced by what you see here.
        </p>
        <p className="text-ink-soft">Until you choose, your changes stay here and in this browser tab.</p>
      </div>
      <DialogActions>
        <Button variant="secondary" onClick={onReloadTheirs}>
          Reload theirs
        </Button>
        <Button onClick={onKeepMine}>Keep mine</Button>
      </DialogActions>
    </Dialog>
  );
}
