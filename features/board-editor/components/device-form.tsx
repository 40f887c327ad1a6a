'use client';

import { memo } from 'react';

import { SelectField } from '@/components/ui/field';
import { deviceOnRailSchema, isProtectiveDevice, STANDARD_RATINGS_A, type DeviceOnRail } from '@/lib/sizing';

import { trayEntry, type TrayKind } from '../utils/device-catalogue';
import { useDraftForm } from '../hooks/use-draft-form';
import { useBoardDraftStore } from '../stores/board-draft-store';

type DeviceFormProps = { wayId: string; readOnly: boolean };

/**
 * Rated breaking capacities offered for circuit-breakers, kA (common BS EN 60898-1 values,
 * from memory; the manufacturer's figure is the one that counts).
 */
const BREAKING_KA = [3, 4.5, 6, 10, 15, 25] as const;

const numberOrNull = { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) } as const;
const numberOrUndefined = { setValueAs: (v: string) => (v === '' || v === undefined ? undefined : Number(v)) } as const;

/**
 * The device of the selected way, a view over the draft (`useDraftForm`) validated with the
 * engine's deviceOnRailSchema. Its kind and width stay as dropped: another device comes from the tray.
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
        <SelectField
          label="Rating"
          error={errors.ratingA?.message}
          options={[
            ...(protective ? [{ value: '', label: 'Choose for me' }] : []),
            ...ratings.map((r) => ({ value: r, label: `${r} A${protective ? ' (fixed)' : ''}` })),
          ]}
          {...register('ratingA', numberOrNull)}
        />
        {breaker ? (
          <SelectField
            label="Curve"
            error={errors.curve?.message}
            options={curves.map((c) => ({ value: c, label: `Type ${c}` }))}
            {...register('curve')}
          />
        ) : null}
        {protective ? (
          <SelectField
            label="Breaking capacity"
            error={errors.breakingKa?.message}
            options={[{ value: '', label: 'Not given' }, ...BREAKING_KA.map((k) => ({ value: k, label: `${k} kA` }))]}
            {...register('breakingKa', numberOrUndefined)}
          />
        ) : null}
        {kind === 'rcd' || kind === 'rcbo' ? (
          <>
            <SelectField
              label="IΔn"
              hint="Rated residual operating current"
              error={errors.rcdMa?.message}
              options={(kind === 'rcbo' ? [10, 30, 100, 300] : [30, 100, 300]).map((m) => ({
                value: m,
                label: `${m} mA`,
              }))}
              {...register('rcdMa', numberOrNull)}
            />
            <SelectField
              label="RCD type"
              error={errors.rcdType?.message}
              options={(['AC', 'A', 'F', 'B'] as const).map((t) => ({ value: t, label: `Type ${t}` }))}
              {...register('rcdType')}
            />
          </>
        ) : null}
      </fieldset>
    </form>
  );
});
