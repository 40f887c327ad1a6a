'use client';

import { memo } from 'react';

import { CircuitFields } from '@/components/sizing/circuit-fields';
import { circuitSpecSchema, type CircuitSpec } from '@/lib/sizing';

import { useDraftForm } from '../hooks/use-draft-form';
import { useBoardDraftStore } from '../stores/board-draft-store';

type CircuitFormProps = { wayId: string; boardPhases: 1 | 3; readOnly: boolean };

/**
 * The circuit of the selected way, a view over the draft (`useDraftForm`), validated with the
 * engine's own circuitSpecSchema, so the panel refuses exactly what the server would.
 */
export const CircuitForm = memo(function CircuitForm({ wayId, boardPhases, readOnly }: CircuitFormProps) {
  const circuit = useBoardDraftStore((s) => s.ways.find((w) => w.id === wayId)?.circuit) as CircuitSpec;
  const form = useDraftForm(`circuit:${wayId}`, circuitSpecSchema, circuit, (value, field) =>
    useBoardDraftStore.getState().updateCircuit(wayId, value, `circuit:${wayId}:${field}`),
  );
  const errors = form.formState.errors;

  return (
    <form aria-label="Circuit" noValidate onSubmit={(e) => e.preventDefault()} data-way-form={wayId}>
      <fieldset
        disabled={readOnly}
        className="grid grid-cols-2 gap-x-3 gap-y-3 [&_:is(input,select):disabled]:cursor-not-allowed [&_:is(input,select):disabled]:bg-paper-sunk [&_:is(input,select):disabled]:text-ink-soft"
      >
        <legend className="sr-only">Circuit of the way</legend>
        <CircuitFields form={form} prefix="" boardPhases={boardPhases} fullRow="col-span-2" />
        {errors.root?.message ? <p className="col-span-2 text-xs text-verdict-fail">{errors.root.message}</p> : null}
      </fieldset>
    </form>
  );
});
