import { isDeepStrictEqual } from 'node:util';

import type { WayInput } from './schemas';

/** What changed between the stored ways and the saved ones, for the audit trail. */
export function diffWays(before: WayInput[], after: WayInput[]) {
  const old = new Map(before.map((w) => [w.id, w]));
  const now = new Map(after.map((w) => [w.id, w]));
  const added = after.filter((w) => !old.has(w.id)).map((w) => w.id);
  const removed = before.filter((w) => !now.has(w.id)).map((w) => w.id);
  const moved: string[] = [];
  const changed: string[] = [];
  for (const w of after) {
    const o = old.get(w.id);
    if (!o) continue;
    if (o.rail !== w.rail || o.position !== w.position) moved.push(w.id);
    // Compared by value: stored JSON comes back with its keys in PostgreSQL's order
    if (!isDeepStrictEqual(o.device, w.device) || !isDeepStrictEqual(o.circuit, w.circuit)) {
      changed.push(w.id);
    }
  }
  return { added, removed, moved, changed };
}
