import { Zap } from 'lucide-react';

import { cn } from '@/lib/cn';
import { deviceFaceName } from '@/lib/names';
import type { DeviceOnRail } from '@/lib/sizing';

import { ratingText } from '../utils/device-catalogue';

const FACE: Record<string, string> = {
  'main-switch': 'bg-ink text-paper border-ink',
  rcd: 'bg-paper-sunk text-ink border-line-strong',
  mcb: 'bg-white text-ink border-line-strong',
  rcbo: 'bg-white text-ink border-line-strong',
  'fuse-bs88-2': 'bg-[#f4efe4] text-ink border-line-strong',
  'fuse-bs88-3': 'bg-[#f4efe4] text-ink border-line-strong',
  'fuse-bs3036': 'bg-[#f4efe4] text-ink border-line-strong',
  spd: 'bg-[#eef1f4] text-ink border-line-strong',
  blank: 'bg-line/60 text-ink-faint border-line-strong',
};

// What fits on a one-module face
const NARROW: Record<string, string> = {
  'fuse-bs88-2': '88-2',
  'fuse-bs88-3': '88-3',
  'fuse-bs3036': '3036',
  blank: '',
};

/**
 * What is printed on the device's front, drawn by CSS: the drawing is a picture (aria-hidden),
 * and its words are not text of the device on the rail, whose name says it all (so the
 * name's words and its visible text agree, WCAG 2.5.3).
 */
function Printed({ text, className }: { text: string; className?: string }) {
  return <span data-text={text} className={cn('before:content-[attr(data-text)]', className)} />;
}

/**
 * The front of a device as drawn on the rail: its rating, its kind and a switch lever (or a
 * fuse cartridge, a surge mark, or nothing for a blank). Fills the width it is given.
 */
export function DeviceFace({ device, className }: { device: DeviceOnRail; className?: string }) {
  const rating = ratingText(device);
  const fuse = device.kind.startsWith('fuse');
  const lever = !fuse && device.kind !== 'blank' && device.kind !== 'spd';
  return (
    <div
      aria-hidden
      className={cn(
        'flex h-full w-full flex-col items-center justify-between overflow-hidden rounded-[3px] border px-0.5 py-1 text-center shadow-[inset_0_-6px_0_rgba(0,0,0,0.04)]',
        FACE[device.kind] ?? FACE.mcb,
        className,
      )}
    >
      <Printed text={rating} className="text-[11px] leading-tight font-bold tracking-tight whitespace-nowrap" />
      {lever ? (
        <span
          className={cn(
            'block h-7 rounded-[2px]',
            device.kind === 'main-switch'
              ? 'w-[70%] bg-copper'
              : device.kind === 'rcd'
                ? 'w-[55%] bg-ink/80'
                : 'w-[60%] max-w-4 bg-ink/85',
          )}
        />
      ) : fuse ? (
        <span className="block h-9 w-[55%] max-w-4 rounded-full border border-ink/40 bg-white" />
      ) : device.kind === 'spd' ? (
        <Zap className="h-4 w-4 text-copper" />
      ) : (
        <span />
      )}
      <span className="flex flex-col items-center gap-0.5">
        {device.kind === 'rcd' || device.kind === 'rcbo' ? (
          <Printed
            text={`${device.rcdMa ?? '?'}${device.modules > 1 ? ' mA' : ''}`}
            className="text-[9px] leading-none font-semibold whitespace-nowrap"
          />
        ) : null}
        {device.kind === 'rcd' ? (
          <Printed
            text="T"
            className="flex h-3 w-3 items-center justify-center rounded-full bg-copper text-[7px] font-bold text-white"
          />
        ) : null}
        <Printed
          text={device.modules > 1 ? deviceFaceName(device.kind) : (NARROW[device.kind] ?? deviceFaceName(device.kind))}
          className="text-[8px] leading-none font-semibold tracking-wide whitespace-nowrap uppercase opacity-80"
        />
      </span>
    </div>
  );
}
