'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import type { z } from 'zod';

import { CircuitFields } from '@/components/sizing/circuit-fields';
import { CircuitResultView } from '@/components/sizing/circuit-result-view';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Field, Input, Select } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { deviceKindName } from '@/lib/names';
import {
  circuitInputSchema,
  PROTECTIVE_DEVICE_KINDS,
  RCD_SENSITIVITIES_MA,
  STANDARD_RATINGS_A,
  type CircuitInput,
} from '@/lib/sizing';

import { useSizeCircuit } from '../api/use-size-circuit';

type FormIn = z.input<typeof circuitInputSchema>;

/** A starting point: a 3 kW water heater in twin and earth, clipped direct. */
const defaults: FormIn = {
  supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
  circuit: {
    serves: 'Water heater',
    phases: 1,
    use: 'fixed',
    loadType: 'water-heater',
    load: { kind: 'known', watts: 3000, powerFactor: 1 },
    lengthM: 15,
    cable: 'te-70',
    method: 'C',
    ambientC: 30,
    grouping: { circuits: 1, arrangement: 'bunched' },
    insulationMm: 0,
    csaMm2: null,
    concealedInWall: false,
    buried: false,
    device: { kind: 'mcb', curve: 'B', ratingA: null, breakingKa: 6, rcdMa: null },
  },
};

const num = { valueAsNumber: true } as const;
const emptyIsUndefined = {
  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v)),
} as const;
/** Selects whose empty choice means "let the engine choose" (null). */
const nullableNumber = {
  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined || v === 'null' ? null : Number(v)),
} as const;

function err(errors: FieldErrors<FormIn>, path: string): string | undefined {
  const node = path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown>)?.[k], errors);
  return (node as { message?: string } | undefined)?.message;
}

/**
 * Quick size: one circuit without a board. The form is validated with the engine's own
 * schema, so what the form accepts the server accepts; the server sizes it.
 */
export function QuickSizeForm() {
  const sizing = useSizeCircuit();
  const form = useForm<FormIn, unknown, CircuitInput>({
    resolver: zodResolver(circuitInputSchema),
    defaultValues: defaults,
    mode: 'onChange',
  });
  const { register, handleSubmit, watch, setValue, setError, formState } = form;
  const errors = formState.errors;
  const deviceKind = watch('circuit.device.kind');
  const isBreaker = deviceKind === 'mcb' || deviceKind === 'rcbo';

  // Curve and residual current only apply to some devices.
  useEffect(() => {
    setValue('circuit.device.curve', isBreaker ? (form.getValues('circuit.device.curve') ?? 'B') : undefined);
    if (deviceKind === 'rcbo' && !form.getValues('circuit.device.rcdMa')) {
      setValue('circuit.device.rcdMa', 30);
    }
    setValue('circuit.device.ratingA', null);
  }, [deviceKind, isBreaker, form, setValue]);

  const onSubmit = handleSubmit((input) =>
    sizing.mutate(input, {
      onError: (e) => {
        if (e instanceof ApiError) {
          for (const issue of e.issues) {
            setError(issue.path as never, { message: issue.message });
          }
        }
      },
    }),
  );

  // Size once on arrival so the page opens with a worked result.
  useEffect(() => {
    void onSubmit();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const ratings = STANDARD_RATINGS_A[deviceKind as keyof typeof STANDARD_RATINGS_A] ?? [];

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
      <form onSubmit={onSubmit} className="flex flex-col gap-4" aria-label="Circuit to size" noValidate>
        <Card title="Supply at the board">
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            <Field label="Earthing" error={err(errors, 'supply.earthing')}>
              {(id) => (
                <Select id={id} {...register('supply.earthing')}>
                  <option value="TN-C-S">TN-C-S</option>
                  <option value="TN-S">TN-S</option>
                  <option value="TT">TT</option>
                </Select>
              )}
            </Field>
            <NumberField label="Uo (V)" path="supply.uoV" register={register} errors={errors} />
            <NumberField label="Ze (Ω)" path="supply.zeOhm" register={register} errors={errors} step="0.01" />
            <NumberField label="PFC (kA)" path="supply.pfcKa" register={register} errors={errors} step="0.1" />
            <Field label="Supply" error={err(errors, 'supply.source')}>
              {(id) => (
                <Select id={id} {...register('supply.source')}>
                  <option value="public">Public network</option>
                  <option value="private">Private supply</option>
                </Select>
              )}
            </Field>
          </div>
        </Card>

        <Card title="The circuit">
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            <CircuitFields form={form} prefix="circuit." fullRow="col-span-2 sm:col-span-3" />
          </div>
        </Card>

        <Card title="Protective device">
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            <Field label="Device" error={err(errors, 'circuit.device.kind')}>
              {(id) => (
                <Select id={id} {...register('circuit.device.kind')}>
                  {PROTECTIVE_DEVICE_KINDS.map((k) => (
                    <option key={k} value={k}>
                      {deviceKindName(k)}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            {isBreaker ? (
              <Field label="Curve" error={err(errors, 'circuit.device.curve')}>
                {(id) => (
                  <Select id={id} {...register('circuit.device.curve')}>
                    <option value="B">B</option>
                    <option value="C">C</option>
                    <option value="D">D</option>
                  </Select>
                )}
              </Field>
            ) : null}
            <Field label="Rating" error={err(errors, 'circuit.device.ratingA')}>
              {(id) => (
                <Select id={id} {...register('circuit.device.ratingA', nullableNumber)}>
                  <option value="">Choose for me</option>
                  {ratings.map((r) => (
                    <option key={r} value={r}>
                      {r} A
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <NumberField
              label="Breaking capacity (kA)"
              path="circuit.device.breakingKa"
              register={register}
              errors={errors}
              step="0.5"
            />
            <NumberField
              label="Assembly's conditional rating (kA)"
              hint="Empty unless the board declares one (a consumer unit to BS EN 61439-3: 16 kA)"
              path="circuit.device.conditionalRatingKa"
              register={register}
              errors={errors}
              step="0.5"
              optional
            />
            <Field label="RCD protection" error={err(errors, 'circuit.device.rcdMa')}>
              {(id) => (
                <Select id={id} {...register('circuit.device.rcdMa', nullableNumber)}>
                  {deviceKind !== 'rcbo' ? <option value="">None</option> : null}
                  {RCD_SENSITIVITIES_MA.map((m) => (
                    <option key={m} value={m}>
                      {m} mA
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          </div>
        </Card>

        <div className="flex items-center gap-3">
          <Button type="submit" disabled={sizing.isPending}>
            {sizing.isPending ? 'Sizing…' : 'Size this circuit'}
          </Button>
          {Object.keys(errors).length ? (
            <p role="alert" className="text-sm text-verdict-fail">
              Some fields need attention.
            </p>
          ) : null}
        </div>
      </form>

      <div className="lg:sticky lg:top-4 lg:self-start">
        {sizing.error ? (
          <p role="alert" className="mb-3 rounded-md bg-verdict-fail-bg px-3 py-2 text-sm text-verdict-fail">
            {sizing.error.message}
          </p>
        ) : null}
        {sizing.data ? (
          <CircuitResultView result={sizing.data} />
        ) : (
          <div className="flex flex-col gap-3">
            <p className="rounded-md border border-dashed border-line-strong p-6 text-sm text-ink-soft">
              Fill in the circuit and press “Size this circuit”.
            </p>
            <Caution />
          </div>
        )}
      </div>
    </div>
  );
}

function Card({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <fieldset className="rounded-card border border-line bg-paper-raised p-4">
      <legend className="px-1 text-sm font-semibold">{title}</legend>
      {children}
    </fieldset>
  );
}

function NumberField({
  label,
  hint,
  path,
  register,
  errors,
  step = '1',
  optional = false,
}: {
  label: string;
  hint?: string;
  path: string;
  register: UseFormRegister<FormIn>;
  errors: FieldErrors<FormIn>;
  step?: string;
  /** An empty box means "not given" (undefined) rather than NaN. */
  optional?: boolean;
}) {
  const message = err(errors, path);
  return (
    <Field label={label} hint={hint} error={message}>
      {(id, describedBy) => (
        <Input
          id={id}
          type="number"
          inputMode="decimal"
          step={step}
          aria-invalid={!!message}
          aria-describedby={describedBy}
          {...register(path as never, optional ? emptyIsUndefined : num)}
        />
      )}
    </Field>
  );
}
