'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import type { FieldPath } from 'react-hook-form';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { Field, Input, Select } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import { boardCreateSchema, type BoardCreateInput } from '@/lib/boards/schemas';
import { bindField } from '@/lib/forms/bind-field';
import { numberOrEmpty } from '@/lib/forms/number-or-empty';
import { useServerForm } from '@/lib/forms/use-server-form';

import type { SiteOption } from '../api/boards-api';
import { useCreateBoard } from '../api/use-board-mutations';
import { newBoardDefaults, type BoardCreateValues } from '../utils/board-defaults';

const legendClass = 'mb-3 text-xs font-semibold tracking-wide text-ink-soft uppercase';
const decimal = { type: 'number', step: 'any', inputMode: 'decimal' } as const;
const whole = { type: 'number', step: 1, inputMode: 'numeric' } as const;

const FIELDS: FieldPath<BoardCreateValues>[] = [
  'name',
  'siteId',
  'location',
  'phases',
  'supply.earthing',
  'supply.uoV',
  'supply.zeOhm',
  'supply.pfcKa',
  'supply.source',
  'incoming.kind',
  'incoming.ratingA',
  'incoming.busbarRatingA',
  'enclosureModules',
  'rails',
  'dwelling',
  'conditionalRatingKa',
];

type BoardCreateDialogProps = {
  open: boolean;
  onClose: () => void;
  sites: SiteOption[];
  sitesLoading?: boolean;
  /** Why the sites could not be loaded, if they could not. */
  sitesError?: string | null;
  onRetrySites?: () => void;
  /** Preselects a site (the site page's own). */
  siteId?: string;
};

/** A new, empty board: where it is, its supply, its incoming device and its enclosure. */
export function BoardCreateDialog({
  open,
  onClose,
  sites,
  sitesLoading,
  sitesError,
  onRetrySites,
  siteId,
}: BoardCreateDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      wide
      title="New board"
      description="Record the supply and the enclosure; the ways are arranged in the board editor."
    >
      {sitesLoading ? (
        <p className="py-6 text-sm text-ink-soft" role="status">
          Loading the sites…
        </p>
      ) : sitesError ? (
        <div className="flex flex-col gap-4">
          <FormAlert>The sites could not be loaded: {sitesError}</FormAlert>
          <DialogActions>
            <Button variant="secondary" onClick={onClose}>
              Close
            </Button>
            {onRetrySites ? <Button onClick={onRetrySites}>Try again</Button> : null}
          </DialogActions>
        </div>
      ) : sites.length === 0 ? (
        <div className="flex flex-col gap-4 text-sm text-ink">
          <p>A board belongs to a site, and there are no sites yet.</p>
          <DialogActions>
            <Button variant="secondary" onClick={onClose}>
              Close
            </Button>
            <Link
              href="/sites"
              className="inline-flex h-10 items-center rounded-md border border-ink bg-ink px-4 text-sm font-medium text-paper hover:bg-ink/90"
            >
              Go to sites
            </Link>
          </DialogActions>
        </div>
      ) : (
        <BoardCreateForm sites={sites} siteId={siteId} onClose={onClose} />
      )}
    </Dialog>
  );
}

function BoardCreateForm({ sites, siteId, onClose }: { sites: SiteOption[]; siteId?: string; onClose: () => void }) {
  const router = useRouter();
  const create = useCreateBoard();
  const {
    register,
    formError,
    onSubmit,
    formState: { errors, isSubmitting },
  } = useServerForm<BoardCreateValues, BoardCreateInput>({
    schema: boardCreateSchema,
    defaultValues: newBoardDefaults(siteId ?? (sites.length === 1 ? sites[0].id : '')),
    fields: FIELDS,
    submit: async (input) => {
      // Create the board, then open it in the editor to arrange its ways
      const board = await create.mutateAsync(input);
      toast.success(`Created ${board.name}.`);
      onClose();
      router.push(`/boards/${board.id}`);
    },
  });
  const num = { setValueAs: numberOrEmpty };

  const bind = bindField(register);
  const { supply: supplyErrors, incoming: incomingErrors } = errors;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className={legendClass}>Board</legend>
        <Field label="Board name" error={errors.name?.message} hint="e.g. Workshop DB1">
          {(id, d) => <Input autoComplete="off" {...bind('name', errors.name)(id, d)} />}
        </Field>
        <Field label="Site" error={errors.siteId?.message}>
          {(id, d) => (
            <Select {...bind('siteId', errors.siteId)(id, d)}>
              <option value="">Choose a site…</option>
              {sites.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Location" hint="Where the board is fixed (optional)" error={errors.location?.message}>
          {(id, d) => <Input autoComplete="off" {...bind('location', errors.location)(id, d)} />}
        </Field>
        <Field label="Phases" error={errors.phases?.message}>
          {(id, d) => (
            <Select {...bind('phases', errors.phases, { setValueAs: Number })(id, d)}>
              <option value="1">Single-phase</option>
              <option value="3">Three-phase</option>
            </Select>
          )}
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className={legendClass}>Supply at the origin</legend>
        <Field label="Earthing" error={supplyErrors?.earthing?.message}>
          {(id, d) => (
            <Select {...bind('supply.earthing', supplyErrors?.earthing)(id, d)}>
              <option value="TN-C-S">TN-C-S</option>
              <option value="TN-S">TN-S</option>
              <option value="TT">TT</option>
            </Select>
          )}
        </Field>
        <Field label="Uo (V)" hint="Line to earth" error={supplyErrors?.uoV?.message}>
          {(id, d) => <Input {...decimal} {...bind('supply.uoV', supplyErrors?.uoV, num)(id, d)} />}
        </Field>
        <Field label="Ze (Ω)" hint="Declared or measured" error={supplyErrors?.zeOhm?.message}>
          {(id, d) => <Input {...decimal} {...bind('supply.zeOhm', supplyErrors?.zeOhm, num)(id, d)} />}
        </Field>
        <Field label="Prospective fault current (kA)" error={supplyErrors?.pfcKa?.message}>
          {(id, d) => <Input {...decimal} {...bind('supply.pfcKa', supplyErrors?.pfcKa, num)(id, d)} />}
        </Field>
        <Field label="Supply source" error={supplyErrors?.source?.message}>
          {(id, d) => (
            <Select {...bind('supply.source', supplyErrors?.source)(id, d)}>
              <option value="public">Public network</option>
              <option value="private">Private supply</option>
            </Select>
          )}
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className={legendClass}>Incoming device and enclosure</legend>
        <Field label="Incoming device" error={incomingErrors?.kind?.message}>
          {(id, d) => (
            <Select {...bind('incoming.kind', incomingErrors?.kind)(id, d)}>
              <option value="main-switch">Main switch</option>
              <option value="rcd">RCD</option>
              <option value="mcb">MCB</option>
              <option value="fuse-bs88-2">Fuse (BS 88-2)</option>
            </Select>
          )}
        </Field>
        <Field label="Device rating (A)" error={incomingErrors?.ratingA?.message}>
          {(id, d) => <Input {...whole} {...bind('incoming.ratingA', incomingErrors?.ratingA, num)(id, d)} />}
        </Field>
        <Field label="Busbar rating (A)" hint="Optional" error={incomingErrors?.busbarRatingA?.message}>
          {(id, d) => (
            <Input {...whole} {...bind('incoming.busbarRatingA', incomingErrors?.busbarRatingA, num)(id, d)} />
          )}
        </Field>
        <Field label="Enclosure (modules)" error={errors.enclosureModules?.message}>
          {(id, d) => <Input {...whole} {...bind('enclosureModules', errors.enclosureModules, num)(id, d)} />}
        </Field>
        <Field label="Rails" error={errors.rails?.message}>
          {(id, d) => <Input {...whole} {...bind('rails', errors.rails, num)(id, d)} />}
        </Field>
        <Field
          label="Conditional short-circuit rating (kA)"
          hint="Optional: the assembly's rating its maker declares (a consumer unit to BS EN 61439-3: 16 kA)"
          error={errors.conditionalRatingKa?.message}
        >
          {(id, d) => <Input {...decimal} {...bind('conditionalRatingKa', errors.conditionalRatingKa, num)(id, d)} />}
        </Field>
        <div className="flex items-end pb-2">
          <label className="flex items-center gap-2 text-sm text-ink">
            <input type="checkbox" className="h-4 w-4 accent-copper" {...register('dwelling')} />
            The board serves a dwelling
          </label>
        </div>
      </fieldset>

      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Creating…' : 'Create board'}
        </Button>
      </DialogActions>
    </form>
  );
}
