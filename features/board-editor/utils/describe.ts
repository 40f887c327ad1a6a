import { isProtectiveDevice, type WayResult } from '@/lib/sizing';

import type { EditorWay } from '../types/draft';
import { deviceWords } from './device-catalogue';

const VERDICT = { passes: 'passes', 'near-limit': 'is near its limit', fails: 'fails' } as const;

/** "way 3" or, for a device without a way number, its kind: how the editor names a way aloud. */
export function wayName(way: EditorWay, label: string | null | undefined): string {
  return label ? `way ${label}` : deviceWords(way.device);
}

/** A way in one sentence: its name, device, what it serves and its verdict. */
export function describeWay(way: EditorWay, label: string | null, result?: WayResult | null): string {
  const parts = [label ? `Way ${label}, ${deviceWords(way.device)}` : deviceWords(way.device)];
  if (way.circuit?.serves) parts.push(`serves ${way.circuit.serves}`);
  if (isProtectiveDevice(way.device.kind) && !way.circuit) parts.push('spare');
  if (way.device.kind === 'blank') parts.push('spare module');
  if (result?.result) parts.push(VERDICT[result.result.verdict]);
  return parts.join(', ');
}
