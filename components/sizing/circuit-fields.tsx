'use client';

import { useMemo } from 'react';
import { type FieldValues, type Path, type UseFormReturn, useWatch } from 'react-hook-form';

import { Field, Input, Select } from '@/components/ui/field';
import { cn } from '@/lib/cn';
import {
  ARMOURED_CPC_NAMES,
  ARRANGEMENT_NAMES,
  CABLE_NAMES,
  CABLE_SIZE_WORDS,
  CIRCUIT_FIELD_LABELS as L,
  GROUPING_NAMES,
  LOAD_TYPE_NAMES,
  METHOD_NAMES,
  SPECIAL_LOCATION_NAMES,
  USE_NAMES,
} from '@/lib/names';
import {
  CABLE_KINDS,
  cableRows,
  CIRCUIT_USES,
  type CableKind,
  type Method,
  methodsFor,
  SOCKET_ARRANGEMENT_KINDS,
} from '@/lib/sizing';
import { ARMOURED_CPC_KINDS, LOAD_TYPES, SPECIAL_LOCATIONS } from '@/lib/sizing/types';

type CircuitFieldsProps<T extends FieldValues> = {
  /** The form holding the circuit: the way panel's circuit, or quick size's `circuit`. */
  form: UseFormReturn<T>;
  /** Where the circuit's fields sit in the form: '' (the way panel) or 'circuit.' (quick size). */
  prefix: '' | 'circuit.';
  /** A single-phase board offers no three-phase circuits. */
  boardPhases?: 1 | 3;
  /** Class that makes a field span the whole row of the caller's grid. */
  fullRow: string;
};

const num = { valueAsNumber: true } as const;
const numberOrNull = {
  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v)),
} as const;
const numberOrUndefined = {
  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v)),
} as const;
const optionalWord = {
  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : v),
} as const;

function errorAt(errors: unknown, path: string): string | undefined {
  const node = path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], errors);
  return (node as { message?: string } | undefined)?.message;
}

/**
 * The fields of one circuit, with one name per field (lib/names.ts CIRCUIT_FIELD_LABELS):
 * the way panel and quick size both draw these, so the two screens ask the same questions in
 * the same words. Each control's accessible name is its visible label.
 */
export function CircuitFields<T extends FieldValues>({
  form,
  prefix,
  boardPhases = 3,
  fullRow,
}: CircuitFieldsProps<T>) {
  const { register, setValue, getValues, control, formState } = form;
  const p = (name: string) => `${prefix}${name}` as Path<T>;
  const err = (name: string) => errorAt(formState.errors, p(name));
  const set = (name: string, value: unknown) =>
    setValue(p(name), value as never, { shouldValidate: true, shouldDirty: true });

  const cable = useWatch({ control, name: p('cable') }) as CableKind;
  const method = useWatch({ control, name: p('method') }) as Method;
  const phases = Number(useWatch({ control, name: p('phases') })) === 3 ? 3 : 1;
  const loadKind = useWatch({ control, name: p('load.kind') }) as string;
  const methods = methodsFor(cable);
  const sizes = useMemo(() => cableRows(cable, method, phases)?.map((r) => r.csaMm2) ?? [], [cable, method, phases]);

  const field = (
    name: string,
    input: (id: string, d: string | undefined, invalid: boolean) => React.ReactNode,
    opts: { label: string; hint?: string; wide?: boolean },
  ) => (
    <Field label={opts.label} hint={opts.hint} error={err(name)} className={opts.wide ? fullRow : undefined}>
      {(id, d) => input(id, d, !!err(name))}
    </Field>
  );

  return (
    <>
      {field(
        'serves',
        (id, d, bad) => (
          <Input
            id={id}
            aria-describedby={d}
            aria-invalid={bad}
            placeholder="e.g. Sockets: kitchen"
            {...register(p('serves'))}
          />
        ),
        { label: L.serves, wide: true },
      )}
      {field(
        'use',
        (id, d, bad) => (
          <Select
            id={id}
            aria-describedby={d}
            aria-invalid={bad}
            {...register(p('use'), {
              onChange: (e) => {
                // Keep the kind of load in step with the use where the use decides it
                const use = e.target.value;
                const kind = getValues(p('loadType')) as string | undefined;
                if (use === 'lighting' || use === 'sockets') set('loadType', use);
                else if (kind === 'lighting' || kind === 'sockets' || !kind) set('loadType', 'other');
              },
            })}
          >
            {CIRCUIT_USES.map((u) => (
              <option key={u} value={u}>
                {USE_NAMES[u]}
              </option>
            ))}
          </Select>
        ),
        { label: L.use },
      )}
      {field(
        'loadType',
        (id, d, bad) => (
          <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('loadType'), optionalWord)}>
            <option value="">Not chosen (counted by its use)</option>
            {LOAD_TYPES.map((t) => (
              <option key={t} value={t}>
                {LOAD_TYPE_NAMES[t]}
              </option>
            ))}
          </Select>
        ),
        { label: L.loadType, hint: 'Sets its diversity on the board' },
      )}
      {field(
        'phases',
        (id, d, bad) => (
          <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('phases'), { setValueAs: Number })}>
            <option value="1">Single-phase</option>
            {boardPhases === 3 ? <option value="3">Three-phase</option> : null}
          </Select>
        ),
        { label: L.phases },
      )}
      {field(
        'load.kind',
        (id, d) => (
          <Select
            id={id}
            aria-describedby={d}
            value={loadKind}
            onChange={(e) => {
              if (e.target.value === 'known') {
                set('load', { kind: 'known', watts: 1000, powerFactor: 1 });
              } else {
                set('load', { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 50 });
                set('use', 'sockets');
                set('loadType', 'sockets');
                set('phases', 1);
              }
            }}
          >
            <option value="known">Known load (W)</option>
            <option value="socket-arrangement">Socket-outlet arrangement</option>
          </Select>
        ),
        { label: L.loadGivenAs },
      )}
      {loadKind === 'known' ? (
        <>
          {field(
            'load.watts',
            (id, d, bad) => (
              <Input
                id={id}
                type="number"
                step="any"
                inputMode="decimal"
                aria-describedby={d}
                aria-invalid={bad}
                {...register(p('load.watts'), num)}
              />
            ),
            { label: L.watts },
          )}
          {field(
            'load.powerFactor',
            (id, d, bad) => (
              <Input
                id={id}
                type="number"
                step="0.01"
                inputMode="decimal"
                aria-describedby={d}
                aria-invalid={bad}
                {...register(p('load.powerFactor'), num)}
              />
            ),
            { label: L.powerFactor },
          )}
        </>
      ) : (
        <>
          {field(
            'load.arrangement',
            (id, d, bad) => (
              <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('load.arrangement'))}>
                {SOCKET_ARRANGEMENT_KINDS.map((a) => (
                  <option key={a} value={a}>
                    {ARRANGEMENT_NAMES[a]}
                  </option>
                ))}
              </Select>
            ),
            { label: L.arrangement },
          )}
          {field(
            'load.floorAreaM2',
            (id, d, bad) => (
              <Input
                id={id}
                type="number"
                step="any"
                inputMode="decimal"
                aria-describedby={d}
                aria-invalid={bad}
                {...register(p('load.floorAreaM2'), num)}
              />
            ),
            { label: L.floorAreaM2 },
          )}
          {field(
            'load.assumedA',
            (id, d, bad) => (
              <Input
                id={id}
                type="number"
                step="any"
                inputMode="decimal"
                aria-describedby={d}
                aria-invalid={bad}
                {...register(p('load.assumedA'), numberOrUndefined)}
              />
            ),
            { label: L.assumedA, hint: "Empty: the arrangement's rating" },
          )}
        </>
      )}

      {field(
        'cable',
        (id, d, bad) => (
          <Select
            id={id}
            aria-describedby={d}
            aria-invalid={bad}
            {...register(p('cable'), {
              onChange: (e) => {
                // Only the methods the cable's table has are offered; keep the method valid
                const valid = methodsFor(e.target.value);
                if (!valid.includes(getValues(p('method')) as Method))
                  set('method', valid.includes('C') ? 'C' : valid[0]);
                if (e.target.value !== 'swa-xlpe-90') set('armouredCpc', undefined);
              },
            })}
          >
            {CABLE_KINDS.map((c) => (
              <option key={c} value={c}>
                {CABLE_NAMES[c]}
              </option>
            ))}
          </Select>
        ),
        { label: L.cable, wide: true },
      )}
      {field(
        'method',
        (id, d, bad) => (
          <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('method'))}>
            {methods.map((m) => (
              <option key={m} value={m}>
                {METHOD_NAMES[m]}
              </option>
            ))}
          </Select>
        ),
        { label: L.method, wide: true },
      )}
      {cable === 'swa-xlpe-90'
        ? field(
            'armouredCpc',
            (id, d, bad) => (
              <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('armouredCpc'), optionalWord)}>
                <option value="">
                  {phases === 3 ? 'The armour (a four-core cable)' : 'A spare core (a three-core cable)'}
                </option>
                {ARMOURED_CPC_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {ARMOURED_CPC_NAMES[k]}
                  </option>
                ))}
              </Select>
            ),
            { label: L.armouredCpc, wide: true },
          )
        : null}
      {field(
        'lengthM',
        (id, d, bad) => (
          <Input
            id={id}
            type="number"
            step="any"
            inputMode="decimal"
            aria-describedby={d}
            aria-invalid={bad}
            {...register(p('lengthM'), num)}
          />
        ),
        { label: L.lengthM, hint: 'A ring: the whole loop' },
      )}
      {field(
        'ambientC',
        (id, d, bad) => (
          <Input
            id={id}
            type="number"
            step="any"
            inputMode="decimal"
            aria-describedby={d}
            aria-invalid={bad}
            {...register(p('ambientC'), num)}
          />
        ),
        { label: L.ambientC, hint: method === 'D' ? 'Ground temperature' : undefined },
      )}
      {field(
        'grouping.circuits',
        (id, d, bad) => (
          <Input
            id={id}
            type="number"
            step="1"
            min={1}
            aria-describedby={d}
            aria-invalid={bad}
            {...register(p('grouping.circuits'), num)}
          />
        ),
        { label: L.circuits },
      )}
      {method === 'D'
        ? field(
            'grouping.spacingM',
            (id, d, bad) => (
              <Input
                id={id}
                type="number"
                step="any"
                min={0}
                aria-describedby={d}
                aria-invalid={bad}
                {...register(p('grouping.spacingM'), numberOrUndefined)}
              />
            ),
            { label: L.spacingM, hint: 'Empty or 0: touching' },
          )
        : field(
            'grouping.arrangement',
            (id, d, bad) => (
              <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('grouping.arrangement'))}>
                {(Object.keys(GROUPING_NAMES) as (keyof typeof GROUPING_NAMES)[]).map((g) => (
                  <option key={g} value={g}>
                    {GROUPING_NAMES[g]}
                  </option>
                ))}
              </Select>
            ),
            { label: L.groupedHow },
          )}
      {field(
        'insulationMm',
        (id, d, bad) => (
          <Input
            id={id}
            type="number"
            step="any"
            min={0}
            aria-describedby={d}
            aria-invalid={bad}
            {...register(p('insulationMm'), num)}
          />
        ),
        { label: L.insulationMm, hint: 'Length wholly surrounded' },
      )}
      {field(
        'csaMm2',
        (id, d, bad) => (
          <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('csaMm2'), numberOrNull)}>
            <option value="">{CABLE_SIZE_WORDS.choose}</option>
            {sizes.map((s) => (
              <option key={s} value={s}>
                {CABLE_SIZE_WORDS.fixed(s)}
              </option>
            ))}
          </Select>
        ),
        { label: L.csaMm2 },
      )}
      {field(
        'specialLocation',
        (id, d, bad) => (
          <Select id={id} aria-describedby={d} aria-invalid={bad} {...register(p('specialLocation'), optionalWord)}>
            {SPECIAL_LOCATIONS.map((s) => (
              <option key={s} value={s === 'none' ? '' : s}>
                {SPECIAL_LOCATION_NAMES[s]}
              </option>
            ))}
          </Select>
        ),
        { label: L.specialLocation, wide: true },
      )}
      {method === 'D' ? (
        <label className={cn(fullRow, 'flex items-center gap-2 text-sm text-ink')}>
          <input type="checkbox" className="h-4 w-4 accent-copper" {...register(p('inDucts'))} />
          {L.inDucts}
        </label>
      ) : null}
      <label className={cn(fullRow, 'flex items-center gap-2 text-sm text-ink')}>
        <input type="checkbox" className="h-4 w-4 accent-copper" {...register(p('concealedInWall'))} />
        {L.concealedInWall}
      </label>
      <label className={cn(fullRow, 'flex items-center gap-2 text-sm text-ink')}>
        <input type="checkbox" className="h-4 w-4 accent-copper" {...register(p('buried'))} />
        {L.buried}
      </label>
    </>
  );
}
