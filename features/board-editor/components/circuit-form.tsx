'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo, useRef } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';

import { Field, Input, Select } from '@/components/ui/field';
import { cableRows, circuitSpecSchema, methodsFor, type CircuitSpec } from '@/lib/sizing';

import { ARRANGEMENT_WORDS, CABLE_OPTIONS, METHOD_WORDS, USE_WORDS } from '../utils/circuit-options';
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

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
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
  const { register, setValue, control, formState, reset } = form;
  const errors = formState.errors;
  const lastWritten = useRef<CircuitSpec>(circuit);

  // A change from elsewhere (undo, redo, reload) resets the fields to it
  useEffect(() => {
    if (!same(circuit, lastWritten.current)) {
      lastWritten.current = circuit;
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
      if (!parsed.success || same(parsed.data, lastWritten.current)) return;
      lastWritten.current = parsed.data;
      onValidRef.current(parsed.data, name ?? 'circuit');
    });
    return () => subscription.unsubscribe();
  }, [form]);

  const cable = useWatch({ control, name: 'cable' });
  const method = useWatch({ control, name: 'method' });
  const phases = useWatch({ control, name: 'phases' });
  const loadKind = useWatch({ control, name: 'load.kind' });
  const methods = methodsFor(cable);
  const sizes = useMemo(() => {
    const rows = cableRows(cable, method, phases === 3 ? 3 : 1);
    return rows ? rows.map((r) => r.csaMm2) : [];
  }, [cable, method, phases]);

  const loadErrors = errors.load as Record<string, { message?: string }> | undefined;
  const groupingErrors = errors.grouping as Record<string, { message?: string }> | undefined;

  return (
    <form
      aria-label="Circuit"
      noValidate
      onSubmit={(e) => e.preventDefault()}
      data-way-form={wayId}
    >
      <fieldset disabled={readOnly} className="grid grid-cols-2 gap-x-3 gap-y-3 [&_:is(input,select):disabled]:cursor-not-allowed [&_:is(input,select):disabled]:bg-paper-sunk [&_:is(input,select):disabled]:text-ink-soft">
        <legend className="sr-only">Circuit of the way</legend>
        <Field label="Serves" error={errors.serves?.message} className="col-span-2">
          {(id, d) => <Input id={id} aria-describedby={d} aria-invalid={!!errors.serves} placeholder="e.g. Sockets: kitchen" {...register('serves')} />}
        </Field>
        <Field label="Use" error={errors.use?.message}>
          {(id, d) => (
            <Select id={id} aria-describedby={d} aria-invalid={!!errors.use} {...register('use')}>
              {Object.entries(USE_WORDS).map(([v, l]) => (
                <option key={v} value={v}>
                  {l}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Phases" error={errors.phases?.message}>
          {(id, d) => (
            <Select id={id} aria-describedby={d} aria-invalid={!!errors.phases} {...register('phases', { setValueAs: Number })}>
              <option value="1">Single-phase</option>
              {boardPhases === 3 ? <option value="3">Three-phase</option> : null}
            </Select>
          )}
        </Field>

        <Field label="Load" className="col-span-2">
          {(id) => (
            <Select
              id={id}
              value={loadKind}
              onChange={(e) => {
                const next =
                  e.target.value === 'known'
                    ? { kind: 'known' as const, watts: 1000, powerFactor: 1 }
                    : { kind: 'socket-arrangement' as const, arrangement: 'ring-32' as const, floorAreaM2: 50 };
                setValue('load', next, { shouldValidate: true, shouldDirty: true });
              }}
            >
              <option value="known">A known load (watts)</option>
              <option value="socket-arrangement">A socket-outlet arrangement</option>
            </Select>
          )}
        </Field>
        {loadKind === 'known' ? (
          <>
            <Field label="Load (W)" error={loadErrors?.watts?.message}>
              {(id, d) => <Input id={id} type="number" step="any" inputMode="decimal" aria-describedby={d} aria-invalid={!!loadErrors?.watts} {...register('load.watts', num)} />}
            </Field>
            <Field label="Power factor" error={loadErrors?.powerFactor?.message}>
              {(id, d) => <Input id={id} type="number" step="0.01" inputMode="decimal" aria-describedby={d} aria-invalid={!!loadErrors?.powerFactor} {...register('load.powerFactor', num)} />}
            </Field>
          </>
        ) : (
          <>
            <Field label="Arrangement" error={loadErrors?.arrangement?.message}>
              {(id, d) => (
                <Select id={id} aria-describedby={d} {...register('load.arrangement')}>
                  {Object.entries(ARRANGEMENT_WORDS).map(([v, l]) => (
                    <option key={v} value={v}>
                      {l}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Floor area (m²)" error={loadErrors?.floorAreaM2?.message}>
              {(id, d) => <Input id={id} type="number" step="any" aria-describedby={d} aria-invalid={!!loadErrors?.floorAreaM2} {...register('load.floorAreaM2', num)} />}
            </Field>
            <Field label="Assumed load (A)" hint="Empty: the arrangement's rating" error={loadErrors?.assumedA?.message} className="col-span-2">
              {(id, d) => <Input id={id} type="number" step="any" aria-describedby={d} aria-invalid={!!loadErrors?.assumedA} {...register('load.assumedA', numberOrUndefined)} />}
            </Field>
          </>
        )}

        <Field label="Cable" error={errors.cable?.message} className="col-span-2">
          {(id, d) => (
            <Select
              id={id}
              aria-describedby={d}
              {...register('cable', {
                onChange: (e) => {
                  // Only the methods the cable's table has are offered; keep the method valid
                  const valid = methodsFor(e.target.value);
                  if (!valid.includes(form.getValues('method'))) {
                    setValue('method', valid.includes('C') ? 'C' : valid[0], { shouldValidate: true });
                  }
                },
              })}
            >
              {CABLE_OPTIONS.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Installation method" error={errors.method?.message} className="col-span-2">
          {(id, d) => (
            <Select id={id} aria-describedby={d} aria-invalid={!!errors.method} {...register('method')}>
              {methods.map((m) => (
                <option key={m} value={m}>
                  {METHOD_WORDS[m] ?? m}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Length (m)" error={errors.lengthM?.message} hint="A ring: the whole loop">
          {(id, d) => <Input id={id} type="number" step="any" inputMode="decimal" aria-describedby={d} aria-invalid={!!errors.lengthM} {...register('lengthM', num)} />}
        </Field>
        <Field label="Ambient (°C)" error={errors.ambientC?.message}>
          {(id, d) => <Input id={id} type="number" step="any" aria-describedby={d} aria-invalid={!!errors.ambientC} {...register('ambientC', num)} />}
        </Field>
        <Field label="Grouped circuits" error={groupingErrors?.circuits?.message}>
          {(id, d) => <Input id={id} type="number" step="1" min={1} aria-describedby={d} aria-invalid={!!groupingErrors?.circuits} {...register('grouping.circuits', num)} />}
        </Field>
        <Field label="Grouped how" error={groupingErrors?.arrangement?.message}>
          {(id, d) => (
            <Select id={id} aria-describedby={d} {...register('grouping.arrangement')}>
              <option value="bunched">Bunched or enclosed</option>
              <option value="single-layer">Single layer on a surface</option>
            </Select>
          )}
        </Field>
        <Field label="In insulation (mm)" error={errors.insulationMm?.message} hint="Length wholly surrounded">
          {(id, d) => <Input id={id} type="number" step="any" aria-describedby={d} aria-invalid={!!errors.insulationMm} {...register('insulationMm', num)} />}
        </Field>
        <Field label="Cable size" error={errors.csaMm2?.message} hint="Chosen, or fixed to check">
          {(id, d) => (
            <Select id={id} aria-describedby={d} aria-invalid={!!errors.csaMm2} {...register('csaMm2', numberOrNull)}>
              <option value="">Choose for me</option>
              {sizes.map((s) => (
                <option key={s} value={s}>
                  {s} mm² (fixed)
                </option>
              ))}
            </Select>
          )}
        </Field>
        <label className="col-span-2 flex items-center gap-2 text-sm text-ink">
          <input type="checkbox" className="h-4 w-4 accent-copper" {...register('concealedInWall')} />
          Buried in a wall less than 50 mm deep, without earthed protection
        </label>
        <label className="col-span-2 flex items-center gap-2 text-sm text-ink">
          <input type="checkbox" className="h-4 w-4 accent-copper" {...register('buried')} />
          Buried in the ground
        </label>
        {errors.root?.message ? <p className="col-span-2 text-xs text-verdict-fail">{errors.root.message}</p> : null}
      </fieldset>
    </form>
  );
}
