'use client';

import { toast } from 'sonner';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import { boardRenameSchema } from '@/lib/boards/schemas';
import type { BoardSummary } from '@/lib/boards/types';
import { useServerForm } from '@/lib/forms/use-server-form';

import { useRenameBoard } from '../api/use-board-mutations';

// The form always sends a name, so an empty one is refused here as on the server
const renameFormSchema = boardRenameSchema.required({ name: true });
type RenameValues = z.input<typeof renameFormSchema>;
type RenameInput = z.output<typeof renameFormSchema>;

/** Renames a board or records where it is fixed. */
export function BoardRenameDialog({ board, onClose }: { board: BoardSummary | null; onClose: () => void }) {
  return (
    <Dialog open={board !== null} onClose={onClose} title="Rename board">
      {board ? <RenameForm board={board} onClose={onClose} /> : null}
    </Dialog>
  );
}

function RenameForm({ board, onClose }: { board: BoardSummary; onClose: () => void }) {
  const rename = useRenameBoard();
  const {
    register,
    formError,
    onSubmit,
    formState: { errors, isSubmitting },
  } = useServerForm<RenameValues, RenameInput>({
    schema: renameFormSchema,
    defaultValues: { name: board.name, location: board.location },
    fields: ['name', 'location'],
    submit: async (input) => {
      const saved = await rename.mutateAsync({ boardId: board.id, input });
      toast.success(`Saved ${saved.name}.`);
      onClose();
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <TextField label="Board name" error={errors.name?.message} {...register('name')} />
      <TextField label="Location" hint="Optional" error={errors.location?.message} {...register('location')} />
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save'}
        </Button>
      </DialogActions>
    </form>
  );
}
