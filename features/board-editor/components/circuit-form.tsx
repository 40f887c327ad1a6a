'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { CircuitFields } from '@/components/sizing/circuit-fields';
import { circuitSpecSchema, type CircuitSpec } from '@/lib/sizing';

import { forgetUnfinishedInput, useKeepUnfinishedInput, useUnfinishedInput } from '../hooks/use-unfinished-input';
import { editorErrorMap } from '../utils/error-map';

type CircuitFormInput = z.input<typeof circuitSpecSchema>;

type CircuitFormProps = {
  wayId: string;
  circuit: CircuitSpec;
  boardPhases: 1 | 3;
  readOnly: boolean;
  /** A valid circuit, each time the fields make one; `field` names the field that changed. */
  onValid: (circuit: CircuitSpec, field: string) => void;
};

/**
 * A value in one canonical text: read through the schema, so the keys come in the schema's order
 * and absent optional fields are dropped. A value loaded from the database (jsonb keeps its keys
 * in its own order) and the same value read back from the fields compare equal.
 */
const canonical = (value: unknown) => {
  const parsed = circuitSpecSchema.safeParse(value);
  return JSON.stringify(parsed.success ? parsed.data : value);
};
const num = { valueAsNumber: true } as const;
const numberOrNull = { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) } as const;
const numberOrUndefined = { setValueAs: (v: string) => (v === '' || v === undefined ? undefined : Number(v)) } as const;

/**
 * The circuit of the selected way. Validated with the engine's own schema (circuitSpecSchema),
 * so the panel refuses exactly what the server would. Each valid change goes into the draft at
 * once; an invalid field shows its error and the draft keeps the last valid circuit.
 */
export function CircuitForm({ wayId, circuit, boardPhases, readOnly, onValid }: CircuitFormProps) {
  const keepKey = `circuit:${wayId}`;
  const restored = useUnfinishedInput<CircuitFormInput>(keepKey, circuit);
  const form = useForm<CircuitFormInput, unknown, CircuitSpec>({
    resolver: zodResolver(circuitSpecSchema, { error: editorErrorMap }),
    mode: 'onChange',
    defaultValues: restored ?? circuit,
  });
  const { formState, reset } = form;
  const errors = formState.errors;
  // The circuit the fields show, as canonical text: only a real change is written to the draft
  const lastWritten = useRef(canonical(circuit));

  // A change from elsewhere (undo, redo, reload) resets the fields to it
  useEffect(() => {
    const text = canonical(circuit);
    if (text !== lastWritten.current) {
      // Resetting the fields fires the watch below with this same value: it must not be
      // written back, as a write is a new edit and would empty the redo stack
      lastWritten.current = text;
      forgetUnfinishedInput(keepKey);
      reset(circuit);
    }
  }, [circuit, reset]);

  // Every valid state of the fields goes into the draft
  // Input that is not valid yet survives selecting another way and coming back
  useKeepUnfinishedInput(keepKey, form, circuitSpecSchema, circuit, !!restored);

  const onValidRef = useRef(onValid);
  onValidRef.current = onValid;
  useEffect(() => {
    const subscription = form.watch((values, { name }) => {
      const parsed = circuitSpecSchema.safeParse(values);
      if (!parsed.success) return;
      const text = JSON.stringify(parsed.data);
      if (text === lastWritten.current) return;
      lastWritten.current = text;
      onValidRef.current(parsed.data, name ?? 'circuit');
    });
    return () => subscription.unsubscribe();
  }, [form]);

  return (
    <form
      aria-label="Circuit"
      noValidate
      onSubmit={(e) => e.preventDefault()}
      data-way-form={wayId}
    >
      <fieldset disabled={readOnly} className="grid grid-cols-2 gap-x-3 gap-y-3 [&_:is(input,select):disabled]:cursor-not-allowed [&_:is(input,select):disabled]:bg-paper-sunk [&_:is(input,select):disabled]:text-ink-soft">
        <legend className="sr-only">Circuit of the way</legend>
        <CircuitFields form={form} prefix="" boardPhases={boardPhases} fullRow="col-span-2" />
        {errors.root?.message ? <p className="col-span-2 text-xs text-verdict-fail">{errors.root.message}</p> : null}
      </fieldset>
    </form>
  );
}
