'use client';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';

type ConfirmDialogProps = {
  open: boolean;
  title: string;
  children: React.ReactNode;
  confirmLabel: string;
  pending?: boolean;
  /** A failure from the last attempt, shown above the buttons. */
  error?: string | null;
  danger?: boolean;
  onConfirm: () => void;
  onClose: () => void;
};

/** Asks once before something that cannot be undone. */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  pending,
  error,
  danger = true,
  onConfirm,
  onClose,
}: ConfirmDialogProps) {
  return (
    <Dialog open={open} onClose={onClose} title={title}>
      <div className="text-sm leading-relaxed text-ink">{children}</div>
      {error ? <FormAlert className="mt-4">{error}</FormAlert> : null}
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={pending}>
          Keep it
        </Button>
        <Button variant={danger ? 'danger' : 'primary'} onClick={onConfirm} disabled={pending}>
          {pending ? 'Working…' : confirmLabel}
        </Button>
      </DialogActions>
    </Dialog>
  );
}
