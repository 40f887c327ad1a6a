/**
 * Which ways an RCD protects: the one rule, used by the editor's RCD brackets, the schedule's
 * groups and the engine's `protectedBy` (and the RCD sensitivity each circuit is sized with). Pure.
 *
 * An RCD protects the ways after it on the rail, across rails in rail order, until the next
 * RCD or main switch, as on a split-load board. A spare way (a
 * blank) sits under the RCD before it. An RCBO protects itself. Main switches, RCDs and SPDs
 * feed no way and are protected by nothing. An incoming RCD protects every way up to the first
 * RCD or main switch on the rail.
 */
import { railOrder, type LayoutWay } from './layout';

/** What gives a way its RCD protection. */
export type RcdProtector = { by: 'rcd'; rcdId: string } | { by: 'incoming' } | { by: 'own' } | null;

/** The engine's spelling of an incoming RCD in `protectedBy`. */
export const INCOMING_RCD = 'incoming';

const OUTGOING_PROTECTIVE = new Set(['mcb', 'fuse-bs88-2', 'fuse-bs88-3', 'fuse-bs3036']);

/** Each way's RCD protection, by way id, walking the rail in order. */
export function rcdProtection(ways: readonly LayoutWay[], incomingIsRcd = false): Map<string, RcdProtector> {
  const out = new Map<string, RcdProtector>();
  let upstream: RcdProtector = incomingIsRcd ? { by: 'incoming' } : null;
  for (const way of railOrder(ways)) {
    const kind = way.device.kind;
    if (kind === 'main-switch') upstream = null;
    if (kind === 'rcd') upstream = { by: 'rcd', rcdId: way.id };
    if (kind === 'rcbo') out.set(way.id, { by: 'own' });
    else if (kind === 'blank' || OUTGOING_PROTECTIVE.has(kind)) out.set(way.id, upstream);
    else out.set(way.id, null);
  }
  return out;
}

/** The protector as the engine's `protectedBy` spells it: an RCD's way id, the way's own id, 'incoming' or null. */
export function protectedById(wayId: string, protector: RcdProtector): string | null {
  if (!protector) return null;
  if (protector.by === 'own') return wayId;
  if (protector.by === 'incoming') return INCOMING_RCD;
  return protector.rcdId;
}
