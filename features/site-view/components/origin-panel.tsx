'use client';

import { useState } from 'react';
import type { FieldPath } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { Field, Input, Select } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import { bindField } from '@/lib/forms/bind-field';
import { numberOrEmpty } from '@/lib/forms/number-or-empty';
import { useServerForm } from '@/lib/forms/use-server-form';
import { EARTHING_NAMES, SUPPLY_SOURCE_NAMES } from '@/lib/names';
import { ka, ohm } from '@/lib/sites/supply-words';
import { siteOriginSchema, type SiteOrigin, type SiteOriginInput, type SiteRipple } from '@/lib/sites/tree-types';

import { useSetOrigin } from '../api/use-site-tree';

/** The form's values: the origin as the schema takes it in (empty numbers stay empty). */
type OriginValues = z.input<typeof siteOriginSchema>;
const FIELDS: FieldPath<OriginValues>[] = ['earthing', 'uoV', 'zeOhm', 'pfcKa', 'source'];
const decimal = { type: 'number', step: 'any', inputMode: 'decimal' } as const;

/** What the origin's values are, in a line. */
function originWords(o: SiteOrigin): string {
  return [
    EARTHING_NAMES[o.earthing] ?? o.earthing,
    `Uo ${o.uoV} V`,
    `Ze ${ohm(o.zeOhm)}`,
    `prospective fault current ${ka(o.pfcKa)}`,
    SUPPLY_SOURCE_NAMES[o.source],
  ].join(' · ');
}

/** What a change of the origin did to the boards, in a sentence for the toast. */
export function rippleWords(ripple: SiteRipple): string {
  const boards = ripple.boards.length;
  const ways = ripple.boards.reduce((n, b) => n + b.changedWays.length, 0);
  if (!boards) return 'Origin saved; no board’s values or verdicts changed.';
  const boardWords = boards === 1 ? 'one board' : `${boards} boards`;
  const wayWords =
    ways === 0 ? 'no way changed verdict' : ways === 1 ? 'one way changed verdict' : `${ways} ways changed verdict`;
  return `Origin saved; ${boardWords} sized again with new values, ${wayWords}.`;
}

type OriginPanelProps = {
  siteId: string;
  origin: SiteOrigin | null;
  /** Whether the member may change the origin (the server checks again). */
  canEdit: boolean;
};

/**
 * The site's origin (its supply intake) above the tree: its values, and for a designer a form
 * that changes them. Every board is sized again with the new values in the same request, and
 * the tree shown is the one the server answers.
 */
export function OriginPanel({ siteId, origin, canEdit }: OriginPanelProps) {
  const [editing, setEditing] = useState(false);
  return (
    <div className="flex flex-wrap items-center justify-between gap-3 rounded-card border border-line bg-paper px-4 py-3">
      <div className="min-w-0 text-sm">
        <p className="font-medium text-ink">Origin (supply intake)</p>
        <p className="text-ink-soft" data-testid="origin-values">
          {origin
            ? originWords(origin)
            : 'Not given yet: each board fed from the origin is sized with the supply typed on it.'}
        </p>
      </div>
      {canEdit ? (
        <Button variant="secondary" onClick={() => setEditing(true)}>
          {origin ? 'Change the origin' : 'Give the origin'}
        </Button>
      ) : null}
      <Dialog
        open={editing}
        onClose={() => setEditing(false)}
        title="The site’s origin"
        description="Every board on the site is sized again with these values: those fed from the origin directly, and every board below them."
      >
        {editing ? <OriginForm siteId={siteId} origin={origin} onClose={() => setEditing(false)} /> : null}
      </Dialog>
    </div>
  );
}

function OriginForm({ siteId, origin, onClose }: { siteId: string; origin: SiteOrigin | null; onClose: () => void }) {
  const setOrigin = useSetOrigin(siteId);
  const {
    register,
    formError,
    onSubmit,
    formState: { errors, isSubmitting },
  } = useServerForm<OriginValues, SiteOriginInput>({
    schema: siteOriginSchema,
    defaultValues: origin ?? { earthing: 'TN-C-S', uoV: 230, zeOhm: undefined, pfcKa: undefined, source: 'public' },
    fields: FIELDS,
    submit: async (input) => {
      const { ripple } = await setOrigin.mutateAsync(input);
      toast.success(rippleWords(ripple));
      onClose();
    },
  });
  const num = { setValueAs: numberOrEmpty };
  const bind = bindField(register);

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Earthing" error={errors.earthing?.message}>
          {(id, d) => (
            <Select {...bind('earthing', errors.earthing)(id, d)}>
              <option value="TN-C-S">TN-C-S</option>
              <option value="TN-S">TN-S</option>
              <option value="TT">TT</option>
            </Select>
          )}
        </Field>
        <Field label="Uo (V)" hint="Line to earth" error={errors.uoV?.message}>
          {(id, d) => <Input {...decimal} {...bind('uoV', errors.uoV, num)(id, d)} />}
        </Field>
        <Field label="Ze (Ω)" hint="Declared or measured" error={errors.zeOhm?.message}>
          {(id, d) => <Input {...decimal} {...bind('zeOhm', errors.zeOhm, num)(id, d)} />}
        </Field>
        <Field label="Prospective fault current (kA)" error={errors.pfcKa?.message}>
          {(id, d) => <Input {...decimal} {...bind('pfcKa', errors.pfcKa, num)(id, d)} />}
        </Field>
        <Field label="Supply source" error={errors.source?.message}>
          {(id, d) => (
            <Select {...bind('source', errors.source)(id, d)}>
              <option value="public">{SUPPLY_SOURCE_NAMES.public}</option>
              <option value="private">{SUPPLY_SOURCE_NAMES.private}</option>
            </Select>
          )}
        </Field>
      </div>
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Sizing every board…' : 'Save and size the site'}
        </Button>
      </DialogActions>
    </form>
  );
}
