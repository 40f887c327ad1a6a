'use client';

import { memo } from 'react';

import { Field, Select } from '@/components/ui/field';
import { deviceOnRailSchema, isProtectiveDevice, STANDARD_RATINGS_A, type DeviceOnRail } from '@/lib/sizing';

import { BREAKING_KA } from '../utils/circuit-options';
import { trayEntry, type TrayKind } from '../utils/device-catalogue';
import { useDraftForm } from '../hooks/use-draft-form';
import { useBoardDraftStore } from '../stores/board-draft-store';

type DeviceFormProps = { wayId: string; readOnly: boolean };

const numberOrNull = { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) } as const;
const numberOrUndefined = { setValueAs: (v: string) => (v === '' || v === undefined ? undefined : Number(v)) } as const;

/**
 * The device of the selected way, a view over the draft (`useDraftForm`): rating (chosen by
 * the sizing or fixed), curve, breaking capacity and residual current, validated with the
 * engine's deviceOnRailSchema. Its kind and width stay as dropped: a different device is a new
 * one from the tray.
 */
export const DeviceForm = memo(function DeviceForm({ wayId, readOnly }: DeviceFormProps) {
  const device = useBoardDraftStore((s) => s.ways.find((w) => w.id === wayId)?.device) as DeviceOnRail;
  const form = useDraftForm(`device:${wayId}`, deviceOnRailSchema, device, (value, field) =>
    useBoardDraftStore.getState().updateDevice(wayId, value, `device:${wayId}:${field}`),
  );
  const { register, formState } = form;
  const errors = formState.errors;

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
        {kind === 'blank'
          ? 'A blank covers a spare module; it has nothing to set.'
          : `A ${device.poles}-pole surge protective device; it feeds no circuit.`}
      </p>
    );
  }

  return (
    <form aria-label="Device" noValidate onSubmit={(e) => e.preventDefault()} data-device-form={wayId}>
      <fieldset
        disabled={readOnly}
        className="grid grid-cols-2 gap-x-3 gap-y-3 [&_:is(input,select):disabled]:cursor-not-allowed [&_:is(input,select):disabled]:bg-paper-sunk [&_:is(input,select):disabled]:text-ink-soft"
      >
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
});
