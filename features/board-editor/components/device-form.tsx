'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Field, Select } from '@/components/ui/field';
import { deviceOnRailSchema, isProtectiveDevice, STANDARD_RATINGS_A, type DeviceOnRail } from '@/lib/sizing';

import { BREAKING_KA } from '../utils/circuit-options';
import { trayEntry, type TrayKind } from '../utils/device-catalogue';
import { forgetUnfinishedInput, useKeepUnfinishedInput, useUnfinishedInput } from '../hooks/use-unfinished-input';
import { editorErrorMap } from '../utils/error-map';

type DeviceFormInput = z.input<typeof deviceOnRailSchema>;

type DeviceFormProps = {
  wayId: string;
  device: DeviceOnRail;
  readOnly: boolean;
  onValid: (device: DeviceOnRail, field: string) => void;
};

/**
 * A value in one canonical text: read through the schema, so the keys come in the schema's order
 * and absent optional fields are dropped. A value loaded from the database (jsonb keeps its keys
 * in its own order) and the same value read back from the fields compare equal.
 */
const canonical = (value: unknown) => {
  const parsed = deviceOnRailSchema.safeParse(value);
  return JSON.stringify(parsed.success ? parsed.data : value);
};
const numberOrNull = { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) } as const;
const numberOrUndefined = { setValueAs: (v: string) => (v === '' || v === undefined ? undefined : Number(v)) } as const;

/**
 * The device of the selected way: rating (chosen by the sizing or fixed), curve, breaking
 * capacity and residual current, validated with the engine's deviceOnRailSchema. Its kind and
 * width stay as dropped: a different device is a new one from the tray.
 */
export function DeviceForm({ wayId, device, readOnly, onValid }: DeviceFormProps) {
  const keepKey = `device:${wayId}`;
  const restored = useUnfinishedInput<DeviceFormInput>(keepKey, device);
  const form = useForm<DeviceFormInput, unknown, DeviceOnRail>({
    resolver: zodResolver(deviceOnRailSchema, { error: editorErrorMap }),
    mode: 'onChange',
    defaultValues: restored ?? device,
  });
  const { register, formState, reset } = form;
  const errors = formState.errors;
  // The device the fields show, as canonical text: only a real change is written to the draft
  const lastWritten = useRef(canonical(device));

  useEffect(() => {
    const text = canonical(device);
    if (text !== lastWritten.current) {
      // Resetting the fields fires the watch below with this same value: it must not be
      // written back, as a write is a new edit and would empty the redo stack
      lastWritten.current = text;
      forgetUnfinishedInput(keepKey);
      reset(device);
    }
  }, [device, reset]);

  // Input that is not valid yet survives selecting another way and coming back
  useKeepUnfinishedInput(keepKey, form, deviceOnRailSchema, device, !!restored);

  const onValidRef = useRef(onValid);
  onValidRef.current = onValid;
  useEffect(() => {
    const subscription = form.watch((values, { name }) => {
      const parsed = deviceOnRailSchema.safeParse(values);
      if (!parsed.success) return;
      const text = JSON.stringify(parsed.data);
      if (text === lastWritten.current) return;
      lastWritten.current = text;
      onValidRef.current(parsed.data, name ?? 'device');
    });
    return () => subscription.unsubscribe();
  }, [form]);

  const kind = device.kind;
  const protective = isProtectiveDevice(kind);
  const breaker = kind === 'mcb' || kind === 'rcbo';
  const entry = kind === 'fuse-bs88-3' ? null : trayEntry(kind as TrayKind);
  const listed: readonly number[] = protective
    ? STANDARD_RATINGS_A[kind as keyof typeof STANDARD_RATINGS_A]
    : (entry?.ratings ?? []);
  // A stored rating the list lacks stays choosable
  const ratings =
    device.ratingA && !listed.includes(device.ratingA) ? [...listed, device.ratingA].sort((a, b) => a - b) : listed;
  const curves = kind === 'rcbo' ? (['B', 'C'] as const) : (['B', 'C', 'D'] as const);

  if (kind === 'blank' || kind === 'spd') {
    return (
      <p className="text-sm text-ink-soft">
        {kind === 'blank' ? 'A blank covers a spare module; it has nothing to set.' : `A ${device.poles}-pole surge protective device; it feeds no circuit.`}
      </p>
    );
  }

  return (
    <form aria-label="Device" noValidate onSubmit={(e) => e.preventDefault()} data-device-form={wayId}>
      <fieldset disabled={readOnly} className="grid grid-cols-2 gap-x-3 gap-y-3 [&_:is(input,select):disabled]:cursor-not-allowed [&_:is(input,select):disabled]:bg-paper-sunk [&_:is(input,select):disabled]:text-ink-soft">
        <legend className="sr-only">Device of the way</legend>
        <Field label="Rating" error={errors.ratingA?.message}>
          {(id, d) => (
            <Select id={id} aria-describedby={d} aria-invalid={!!errors.ratingA} {...register('ratingA', numberOrNull)}>
              {protective ? <option value="">Choose for me</option> : null}
              {ratings.map((r) => (
                <option key={r} value={r}>
                  {r} A{protective ? ' (fixed)' : ''}
                </option>
              ))}
            </Select>
          )}
        </Field>
        {breaker ? (
          <Field label="Curve" error={errors.curve?.message}>
            {(id, d) => (
              <Select id={id} aria-describedby={d} aria-invalid={!!errors.curve} {...register('curve')}>
                {curves.map((c) => (
                  <option key={c} value={c}>
                    Type {c}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        ) : null}
        {protective ? (
          <Field label="Breaking capacity" error={errors.breakingKa?.message}>
            {(id, d) => (
              <Select id={id} aria-describedby={d} {...register('breakingKa', numberOrUndefined)}>
                <option value="">Not given</option>
                {BREAKING_KA.map((k) => (
                  <option key={k} value={k}>
                    {k} kA
                  </option>
                ))}
              </Select>
            )}
          </Field>
        ) : null}
        {kind === 'rcd' || kind === 'rcbo' ? (
          <>
            <Field label="IΔn" hint="Rated residual operating current" error={errors.rcdMa?.message}>
              {(id, d) => (
                <Select id={id} aria-describedby={d} aria-invalid={!!errors.rcdMa} {...register('rcdMa', numberOrNull)}>
                  {(kind === 'rcbo' ? [10, 30, 100, 300] : [30, 100, 300]).map((m) => (
                    <option key={m} value={m}>
                      {m} mA
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="RCD type" error={errors.rcdType?.message}>
              {(id, d) => (
                <Select id={id} aria-describedby={d} {...register('rcdType')}>
                  {(['AC', 'A', 'F', 'B'] as const).map((t) => (
                    <option key={t} value={t}>
                      Type {t}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          </>
        ) : null}
      </fieldset>
    </form>
  );
}
