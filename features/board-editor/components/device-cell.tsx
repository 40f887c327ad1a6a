'use client';

import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { CircleDashed } from 'lucide-react';
import { memo } from 'react';

import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { cn } from '@/lib/cn';
import { isProtectiveDevice } from '@/lib/sizing';

import { useBoardView } from '../hooks/use-board-view';
import { useDraftSizing } from '../hooks/use-live-sizing';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { describeWay } from '../utils/describe';
import { DeviceFace } from './device-face';

/**
 * A verdict while a newer sizing is on its way (the drawn board's `data-sizing`): dimmed after
 * a moment, by CSS, so that neither the devices nor the legend are drawn again for it.
 */
export const PENDING_DIM =
  'transition-opacity group-data-[sizing=pending]/board:opacity-50 group-data-[sizing=pending]/board:delay-300';

type DeviceCellProps = {
  wayId: string;
  label: string | null;
  /** The module the device starts at on its rail. */
  start: number;
};

/**
 * One device on the rail at its module width, its verdict as icon and colour (in words: the
 * rail's legend, and the tip on hover and focus). Drag it to move it; click or Enter selects
 * it; Delete removes it (undoable).
 */
export const DeviceCell = memo(function DeviceCell({ wayId, label, start }: DeviceCellProps) {
  const way = useBoardDraftStore((s) => s.ways.find((w) => w.id === wayId))!;
  const selected = useBoardDraftStore((s) => s.selection.includes(wayId));
  const { readOnly, showVerdicts: showVerdict, onRemove } = useBoardView();
  // Its own way's result only: an answer that leaves it as it was does not draw it again
  const result = useDraftSizing((s) => s.result.ways.find((w) => w.id === wayId));
  const onSelect = useBoardDraftStore((s) => s.select);
  const { attributes, listeners, setNodeRef, transform, transition, isDragging } = useSortable({
    id: way.id,
    data: { from: 'rail', wayId: way.id, rail: way.rail },
    disabled: readOnly,
  });
  const { device, circuit } = way;
  const verdict = result?.result?.verdict;
  const spare = isProtectiveDevice(device.kind) && !circuit;
  const description = describeWay(way, label, showVerdict ? result : null);

  return (
    <div
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      // Selectable even when it may not be moved (read-only), so never announced as disabled
      aria-disabled={undefined}
      aria-roledescription="device on the rail"
      aria-label={description}
      aria-pressed={selected}
      data-way-id={way.id}
      data-way-label={label ?? ''}
      onClick={() => onSelect(way.id)}
      onKeyDown={(event) => {
        if (event.key === 'Enter') {
          event.preventDefault();
          onSelect(way.id);
          return;
        }
        if ((event.key === 'Delete' || event.key === 'Backspace') && !readOnly) {
          event.preventDefault();
          onRemove(way.id);
          return;
        }
        listeners?.onKeyDown?.(event);
      }}
      style={{
        gridColumn: `${start + 1} / span ${device.modules}`,
        gridRow: 1,
        transform: CSS.Translate.toString(transform),
        transition,
      }}
      className={cn(
        'group relative z-10 flex min-w-0 cursor-pointer flex-col items-stretch gap-1 rounded-sm px-[1px] pt-0.5 pb-1 outline-none select-none',
        'focus-visible:ring-2 focus-visible:ring-copper focus-visible:ring-offset-1',
        selected && 'bg-copper-light ring-2 ring-copper',
        isDragging && 'opacity-40',
        !readOnly && 'cursor-grab active:cursor-grabbing',
      )}
    >
      {/* Drawn by CSS like the device's face: the cell's name carries the reference in words */}
      <span
        data-text={label ?? ''}
        className="h-4 truncate text-center font-mono text-[10px] leading-4 font-semibold text-ink before:content-[attr(data-text)]"
      />
      <div className="h-[100px]">
        <DeviceFace device={device} />
      </div>
      <div className="flex h-6 items-center justify-center">
        {showVerdict && verdict ? (
          <VerdictBadge verdict={verdict} iconOnly className={PENDING_DIM} />
        ) : spare || device.kind === 'blank' ? (
          <span
            data-spare
            className="inline-flex rounded-full border border-dashed border-line-strong bg-paper p-0.5 text-ink-soft"
          >
            <CircleDashed aria-hidden className="h-3.5 w-3.5" />
          </span>
        ) : null}
      </div>
      {/* The whole way in words on hover and focus; the same words are the cell's name */}
      {isDragging ? null : (
        <span
          aria-hidden
          data-way-tip
          className="pointer-events-none absolute top-full left-1/2 z-30 mt-1 hidden w-max max-w-56 -translate-x-1/2 rounded-md bg-ink px-2 py-1 text-left text-xs leading-snug font-medium text-paper shadow-lg group-hover:block group-focus-visible:block"
        >
          {description}
        </span>
      )}
    </div>
  );
});
