'use client';

import { useDraggable } from '@dnd-kit/core';
import { GripVertical, Plus } from 'lucide-react';
import { useState } from 'react';

import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';
import type { DeviceOnRail } from '@/lib/sizing';

import {
  deviceFromChoice,
  deviceWords,
  initialChoices,
  trayEntry,
  trayFor,
  type TrayChoice,
  type TrayEntry,
  type TrayKind,
} from '../utils/device-catalogue';

type DeviceTrayProps = {
  boardPhases: 1 | 3;
  /** Puts the active device at the first place it fits (the keyboard's way in). */
  onAdd: (device: DeviceOnRail) => void;
};

/** The tray id of a kind's draggable chip. */
const trayDragId = (kind: TrayKind) => `tray:${kind}`;

type TrayChipProps = { kind: TrayKind; device: DeviceOnRail; active: boolean; onActivate: () => void };

function TrayChip({ kind, device, active, onActivate }: TrayChipProps) {
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({
    id: trayDragId(kind),
    data: { from: 'tray', kind, device },
  });
  return (
    <div
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      aria-roledescription="device in the tray"
      aria-label={`${deviceWords(device)} from the device tray`}
      aria-pressed={active}
      data-tray-kind={kind}
      onClick={onActivate}
      onKeyDown={(event) => {
        if (event.key === 'Enter') {
          event.preventDefault();
          onActivate();
          return;
        }
        listeners?.onKeyDown?.(event);
      }}
      className={cn(
        'flex h-10 cursor-grab items-center gap-1.5 rounded-md border bg-paper-raised pr-2.5 pl-1 text-xs font-medium whitespace-nowrap text-ink select-none active:cursor-grabbing',
        'focus-visible:ring-2 focus-visible:ring-copper focus-visible:outline-none',
        active ? 'border-copper ring-1 ring-copper' : 'border-line-strong hover:border-ink-faint',
        isDragging && 'opacity-50',
      )}
    >
      <GripVertical aria-hidden className="h-4 w-4 text-ink-faint" />
      {deviceWords(device)}
    </div>
  );
}

/** The variants a tray entry lets the designer pick, in the tray's order (a single option is no choice). */
const choicesOf = (e: TrayEntry) =>
  [
    { field: 'poles', label: 'Poles', options: e.poles.length > 1 ? e.poles : undefined, unit: '' },
    { field: 'curve', label: 'Curve', options: e.curves, unit: '' },
    { field: 'ratingA', label: 'Rating', options: e.ratings, unit: ' A' },
    { field: 'rcdMa', label: 'Trips at', options: e.rcdMa, unit: ' mA' },
    { field: 'rcdType', label: 'Type', options: e.rcdTypes, unit: '' },
  ] as const;

/**
 * The device tray: one chip per kind, showing the variant it will drop; the chip picked shows
 * its choices. Drag a chip onto the board, or "Add to the board" puts it where it first fits.
 */
export function DeviceTray({ boardPhases, onAdd }: DeviceTrayProps) {
  // The choices, kept per number of phases so that the tray's defaults follow the board's supply
  // when it changes, and the kind whose choices are shown
  const [choicesByPhases, setChoicesByPhases] = useState(() => ({ 1: initialChoices(1), 3: initialChoices(3) }));
  const [active, setActive] = useState<TrayKind>('mcb');
  const choices = choicesByPhases[boardPhases];
  const entry = trayEntry(active, boardPhases);
  const choice = choices[active];
  const set = (patch: Partial<TrayChoice>) =>
    setChoicesByPhases((c) => ({ ...c, [boardPhases]: { ...c[boardPhases], [active]: { ...choice, ...patch } } }));
  const activeDevice = deviceFromChoice(active, choice);
  const needsThree = boardPhases === 1 && choice.poles >= 3;
  return (
    <section aria-label="Device tray" className="rounded-card border border-line bg-paper-raised p-3">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 className="text-sm font-semibold text-ink">Device tray</h2>
        <p className="text-xs text-ink-faint">Pick a device, set it up, then drag it onto a rail.</p>
      </div>
      <div className="flex flex-wrap gap-1.5">
        {trayFor(boardPhases).map((e) => (
          <TrayChip
            key={e.kind}
            kind={e.kind}
            device={deviceFromChoice(e.kind, choices[e.kind])}
            active={e.kind === active}
            onActivate={() => setActive(e.kind)}
          />
        ))}
      </div>
      <div
        className="mt-2 flex flex-wrap items-center gap-x-4 gap-y-2 rounded-md bg-paper-sunk/70 px-3 py-2"
        aria-label={`${entry.name} choices`}
        role="group"
      >
        <span className="text-xs font-semibold text-ink">{entry.name}</span>
        <span className="text-xs text-ink-faint">{entry.purpose}</span>
        {choicesOf(entry).map(({ field, label, options, unit }) =>
          options ? (
            <label key={field} className="flex items-center gap-1.5 text-xs text-ink-soft">
              {label}
              <select
                value={String(choice[field] ?? '')}
                onChange={(e) => set({ [field]: options.find((o) => String(o) === e.target.value) })}
                className="h-8 rounded-md border border-line-strong bg-paper-raised px-2 text-xs text-ink focus:border-copper focus:outline-none"
              >
                {options.map((o) => (
                  <option key={o} value={o}>{`${o}${unit}`}</option>
                ))}
              </select>
            </label>
          ) : null,
        )}
        <Button size="sm" variant="secondary" className="ml-auto" onClick={() => onAdd(activeDevice)}>
          <Plus aria-hidden className="h-4 w-4" /> Add to the board
        </Button>
        {needsThree ? (
          <p className="w-full text-xs text-verdict-near">
            A {choice.poles}-pole device needs a three-phase board; this one is single-phase.
          </p>
        ) : null}
      </div>
    </section>
  );
}
