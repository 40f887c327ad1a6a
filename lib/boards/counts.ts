/**
 * How many ways, circuits and (three-phase) single-pole positions a board has, counted the
 * way the way numbers are printed. Pure: the boards list, the editor's board summary, the
 * schedule and the e-mails all count through `countWays` and say it with `countWords`, so a
 * board never shows two different counts.
 *
 * A main switch, an RCD or an SPD sits on the rail but is not a way (layout.ts). On a
 * single-phase board each outgoing device is one way; on a three-phase board a way is one
 * way number with its three single-pole positions (1L1, 1L2, 1L3), and a three-pole device
 * takes all three.
 */
import { plural } from '@/lib/names';

import { layoutWays, type LayoutWay } from './layout';

export type CountedWay = LayoutWay & { circuit: unknown };

export type WayCounts = {
  /** Way numbers in use: the highest way number printed (1–9 counts 9). */
  ways: number;
  /** Outgoing devices that feed a circuit. */
  circuits: number;
  /** Ways (single-phase) or single-pole positions (three-phase) that feed no circuit. */
  spare: number;
  /** Three-phase only: single-pole positions the numbered ways span (three per way), else null. */
  positions: number | null;
};

/** The counts of a board's ways, from the same numbering as the printed way references. */
export function countWays(phases: 1 | 3, ways: readonly CountedWay[]): WayCounts {
  const places = layoutWays(phases, ways);
  const byId = new Map(ways.map((w) => [w.id, w]));
  const numbered = places.filter((p) => p.wayNumber !== null);
  const highest = numbered.reduce((n, p) => Math.max(n, p.wayNumber ?? 0), 0);
  const feeding = numbered.filter((p) => byId.get(p.id)?.circuit);
  if (phases === 1) {
    return { ways: highest, circuits: feeding.length, spare: highest - feeding.length, positions: null };
  }
  const positions = highest * 3;
  const taken = feeding.reduce((n, p) => n + p.phases.length, 0);
  return { ways: highest, circuits: feeding.length, spare: positions - taken, positions };
}

/**
 * The counts in words, the same on every screen and print: "9 ways: 8 circuits, 1 spare" or
 * "8 ways (24 single-pole positions): 15 circuits, 3 positions spare".
 */
export function countWords(counts: WayCounts): string {
  const ways = plural(counts.ways, 'way', 'ways');
  const circuits = plural(counts.circuits, 'circuit', 'circuits');
  if (counts.positions === null) return `${ways}: ${circuits}, ${counts.spare} spare`;
  const positions = plural(counts.positions, 'single-pole position', 'single-pole positions');
  return `${ways} (${positions}): ${circuits}, ${plural(counts.spare, 'position', 'positions')} spare`;
}
