/**
 * What changed between two states of a board (two issued revisions, or an issued
 * revision and the live draft). Pure: the review page, the board page and the e-mails
 * all describe a change the same way.
 */
import { deviceName } from '@/lib/names';

import { railOrder, wayLabelMap } from './layout';
import type { BoardSettings, WayInput } from './schemas';

/** One way as frozen in a revision. */
export type SnapshotWay = Pick<WayInput, 'id' | 'rail' | 'position' | 'device' | 'circuit'>;

/** A board frozen at one moment: what a BoardRevision stores in `snapshot`. */
export type BoardSnapshot = {
  settings: BoardSettings;
  siteName: string;
  organisationName: string;
  ways: SnapshotWay[];
  /**
   * For a board fed from another board's way, that way in words ("Workshop DB1, way 1"): then
   * `settings.supply` is what the site's tree carried down to the board (its Ze is the Zdb), not
   * its typed supply. Absent in revisions issued before boards were frozen with the tree's values.
   */
  fedFrom?: string | null;
};

export type FieldChange = { field: string; label: string; before: string; after: string };

/** A way named the way the schedule names it. */
export type WayMention = { id: string; ref: string | null; serves: string; device: string };

export type RevisionDiff = {
  settings: FieldChange[];
  added: WayMention[];
  removed: WayMention[];
  /** Ways whose place on the rail changed relative to the others (not just shifted along). */
  moved: (WayMention & { fromRef: string | null; from: string; to: string })[];
  /** Ways that kept their place but whose printed way reference changed (labels to redo). */
  renumbered: (WayMention & { fromRef: string | null })[];
  changed: (WayMention & { fields: FieldChange[] })[];
  unchanged: number;
};

const FIELD_LABELS: Record<string, string> = {
  name: 'Board name',
  location: 'Location',
  phases: 'Phases',
  'supply.earthing': 'Earthing',
  'supply.uoV': 'Uo (V)',
  'supply.zeOhm': 'Ze (Ω)',
  'supply.pfcKa': 'PFC (kA)',
  'supply.source': 'Supply source',
  // A board fed from another board: the volt drop its sub-mains used (carried down, lib/supply)
  'supply.vdUsedPct': 'Volt drop used above (%)',
  'incoming.kind': 'Incoming device',
  'incoming.ratingA': 'Incoming rating (A)',
  'incoming.busbarRatingA': 'Busbar rating (A)',
  enclosureModules: 'Enclosure modules',
  rails: 'Rails',
  dwelling: 'Dwelling',
  'device.kind': 'Device',
  'device.poles': 'Poles',
  'device.modules': 'Modules',
  'device.curve': 'Curve',
  'device.ratingA': 'Rating (A)',
  'device.rcdMa': 'Residual current (mA)',
  'device.rcdType': 'RCD type',
  'device.breakingKa': 'Breaking capacity (kA)',
  circuit: 'Circuit',
  'circuit.serves': 'Serves',
  'circuit.phases': 'Circuit phases',
  'circuit.use': 'Use',
  'circuit.load.kind': 'Load kind',
  'circuit.load.watts': 'Load (W)',
  'circuit.load.powerFactor': 'Power factor',
  'circuit.load.arrangement': 'Socket arrangement',
  'circuit.load.floorAreaM2': 'Floor area (m²)',
  'circuit.load.assumedA': 'Assumed load (A)',
  'circuit.lengthM': 'Run length (m)',
  'circuit.cable': 'Cable',
  'circuit.method': 'Reference method',
  'circuit.ambientC': 'Ambient (°C)',
  'circuit.grouping.circuits': 'Grouped circuits',
  'circuit.grouping.arrangement': 'Grouping arrangement',
  'circuit.insulationMm': 'Insulation (mm)',
  'circuit.csaMm2': 'Line conductor (mm²)',
  'circuit.cpcMm2': 'cpc (mm²)',
  'circuit.concealedInWall': 'Concealed in wall',
  'circuit.buried': 'Buried',
  'circuit.dwelling': 'In a dwelling',
};

// The phase a single-pole device sits on follows from its position; a move already says it.
const IGNORED = new Set(['device.phase']);

/** The words printed on a way's label (the label strip, the walk and the schedule use them). */
export function labelTextOf(way: Pick<SnapshotWay, 'device' | 'circuit'>): string {
  if (way.circuit) return way.circuit.serves?.trim() || 'Circuit (not named)';
  if (way.device.kind === 'main-switch') return 'Main switch';
  if (way.device.kind === 'rcd') return way.device.rcdMa ? `RCD ${way.device.rcdMa} mA` : 'RCD';
  if (way.device.kind === 'spd') return 'Surge protection';
  return 'Spare';
}

/** Flattens nested plain values to dotted paths (`supply.uoV`). */
function flatten(value: unknown, prefix: string, out: Map<string, string>): void {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      flatten(v, prefix ? `${prefix}.${k}` : k, out);
    }
    return;
  }
  if (value === undefined) return;
  out.set(prefix, value === null ? '—' : String(value));
}

/** Field-by-field differences of two plain objects, named for people. */
export function diffFields(before: unknown, after: unknown, prefix = ''): FieldChange[] {
  const a = new Map<string, string>();
  const b = new Map<string, string>();
  flatten(before, prefix, a);
  flatten(after, prefix, b);
  const keys = [...new Set([...a.keys(), ...b.keys()])].filter((k) => !IGNORED.has(k));
  return keys
    .filter((k) => a.get(k) !== b.get(k))
    .map((k) => ({
      field: k,
      label: FIELD_LABELS[k] ?? k,
      before: a.get(k) ?? '—',
      after: b.get(k) ?? '—',
    }));
}

/** Indexes of the longest strictly increasing subsequence of `values` (patience sorting). */
function longestIncreasing(values: number[]): Set<number> {
  const tails: number[] = [];
  const prev = new Array<number>(values.length).fill(-1);
  for (let i = 0; i < values.length; i += 1) {
    let lo = 0;
    let hi = tails.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (values[tails[mid]] < values[i]) lo = mid + 1;
      else hi = mid;
    }
    if (lo > 0) prev[i] = tails[lo - 1];
    tails[lo] = i;
  }
  const keep = new Set<number>();
  let k = tails.length ? tails[tails.length - 1] : -1;
  while (k >= 0) {
    keep.add(k);
    k = prev[k];
  }
  return keep;
}

/** Way references of a snapshot's ways, by way id. */
export function wayRefs(snapshot: Pick<BoardSnapshot, 'settings' | 'ways'>): Map<string, string | null> {
  return wayLabelMap(snapshot.settings.phases, snapshot.ways);
}

function mention(way: SnapshotWay, ref: string | null): WayMention {
  return {
    id: way.id,
    ref,
    serves: way.circuit?.serves?.trim() || (way.circuit ? '(not named)' : 'Spare'),
    device: deviceName(way.device),
  };
}

const place = (w: SnapshotWay) => `rail ${w.rail + 1}, place ${w.position + 1}`;

/**
 * The changes from `before` to `after`: board settings, ways added and removed, ways moved
 * (the fewest ways whose move explains the new order), ways renumbered by the moves of
 * others, and ways whose device or circuit changed, field by field.
 */
export function diffRevisions(before: BoardSnapshot, after: BoardSnapshot): RevisionDiff {
  const oldRefs = wayRefs(before);
  const newRefs = wayRefs(after);
  const oldWays = railOrder(before.ways);
  const newWays = railOrder(after.ways);
  const oldById = new Map(oldWays.map((w, i) => [w.id, { way: w, index: i }]));
  const newIds = new Set(newWays.map((w) => w.id));

  const settings = diffFields(before.settings, after.settings);
  const added = newWays.filter((w) => !oldById.has(w.id)).map((w) => mention(w, newRefs.get(w.id) ?? null));
  const removed = oldWays.filter((w) => !newIds.has(w.id)).map((w) => mention(w, oldRefs.get(w.id) ?? null));

  // Ways kept, in their new order; those outside the longest run still in the old order moved.
  const kept = newWays.filter((w) => oldById.has(w.id));
  const stayed = longestIncreasing(kept.map((w) => oldById.get(w.id)!.index));
  const moved: RevisionDiff['moved'] = [];
  const renumbered: RevisionDiff['renumbered'] = [];
  const changed: RevisionDiff['changed'] = [];
  let unchanged = 0;
  kept.forEach((w, i) => {
    const old = oldById.get(w.id)!.way;
    const ref = newRefs.get(w.id) ?? null;
    const fromRef = oldRefs.get(w.id) ?? null;
    const railChanged = old.rail !== w.rail;
    if (!stayed.has(i) || railChanged) {
      moved.push({ ...mention(w, ref), fromRef, from: place(old), to: place(w) });
    } else if (fromRef !== ref) {
      renumbered.push({ ...mention(w, ref), fromRef });
    }
    const fields = [
      ...diffFields(old.device, w.device, 'device'),
      ...(old.circuit && w.circuit
        ? diffFields(old.circuit, w.circuit, 'circuit')
        : old.circuit || w.circuit
          ? [
              {
                field: 'circuit',
                label: 'Circuit',
                before: old.circuit ? (old.circuit.serves ?? 'a circuit') : 'Spare',
                after: w.circuit ? (w.circuit.serves ?? 'a circuit') : 'Spare',
              },
            ]
          : []),
    ];
    if (fields.length) changed.push({ ...mention(w, ref), fields });
    else if (stayed.has(i) && !railChanged && fromRef === ref) unchanged += 1;
  });
  return { settings, added, removed, moved, renumbered, changed, unchanged };
}

/** True when the diff holds no change at all. */
export function isEmptyDiff(diff: RevisionDiff): boolean {
  return (
    !diff.settings.length &&
    !diff.added.length &&
    !diff.removed.length &&
    !diff.moved.length &&
    !diff.renumbered.length &&
    !diff.changed.length
  );
}
