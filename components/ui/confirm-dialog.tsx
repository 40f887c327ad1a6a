'use client';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';

type ConfirmDialogProps = {
  open: boolean;
  title: string;
  description?: React.ReactNode;
  children: React.ReactNode;
  confirmLabel: string;
  /** The button that closes the dialog without doing it. */
  cancelLabel?: string;
  pending?: boolean;
  /** A failure from the last attempt, shown above the buttons. */
  error?: string | null;
  danger?: boolean;
  /** Wider panel for long content. */
  wide?: boolean;
  onConfirm: () => void;
  onClose: () => void;
};

/** Asks once before an action (by default one that cannot be undone: a danger button). */
export function ConfirmDialog({
  open,
  title,
  description,
  children,
  confirmLabel,
  cancelLabel = 'Keep it',
  pending,
  error,
  danger = true,
  wide,
  onConfirm,
  onClose,
}: ConfirmDialogProps) {
  return (
    <Dialog open={open} onClose={onClose} title={title} description={description} wide={wide}>
      <div className="text-sm leading-relaxed text-ink">{children}</div>
      {error ? <FormAlert className="mt-4">{error}</FormAlert> : null}
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={pending}>
          {cancelLabel}
        </Button>
        <Button variant={danger ? 'danger' : 'primary'} onClick={onConfirm} disabled={pending}>
          {pending ? 'Working…' : confirmLabel}
        </Button>
      </DialogActions>
    </Dialog>
  );
}
