import type { SelectivityPair, Working } from './types';

/** Pairs of one judgement: the device above, one kind of device below and the ways it sits in. */
export type SelectivityGroup = {
  kind: SelectivityPair['kind'];
  upstream: string;
  /** The device below in words, without its way ("MCB B16"). */
  device: string;
  /** Where each such device sits, in board order ("way 3", "way 4", "incoming"). */
  places: string[];
  outcome: SelectivityPair['outcome'];
  upToA: number | null;
  working: Working;
};

/** "MCB B16, way 3" → ["MCB B16", "way 3"]; "RCD 30 mA, incoming" → ["RCD 30 mA", "incoming"]. */
function splitPlace(words: string): [string, string | null] {
  const m = /^(.*), ((?:way|incoming)\b.*)$/.exec(words);
  return m ? [m[1], m[2]] : [words, null];
}

/** Whether two strings lists hold the same strings in the same order. */
function sameStrings(a: readonly string[], b: readonly string[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** A working with its three fields and no other (as every judgement writes it). */
function plainWorking(w: Working): boolean {
  let n = 0;
  for (const k in w) {
    if (k !== 'text' && k !== 'steps' && k !== 'sources') return false;
    n++;
  }
  return n === 3 && Array.isArray(w.steps) && Array.isArray(w.sources);
}

/** Whether two workings say the same (as their JSON texts would compare). */
function sameWorking(a: Working, b: Working): boolean {
  if (a === b) return true;
  if (plainWorking(a) && plainWorking(b)) {
    return a.text === b.text && sameStrings(a.steps, b.steps) && sameStrings(a.sources, b.sources);
  }
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * A board's selectivity pairs grouped by what was judged: the same device above, the same kind
 * of device below, the same outcome and the same working. A board of 36 B16 ways below one
 * sub-main is one judgement with 36 places, printed once with its working rather than 36 times.
 * Groups come in the order of their first pair. (The workings are compared field by field, not
 * as JSON texts: a board's pairs are many and their workings long.)
 */
export function groupSelectivity(pairs: readonly SelectivityPair[]): SelectivityGroup[] {
  const groups: SelectivityGroup[] = [];
  const byJudgement = new Map<string, SelectivityGroup[]>();
  for (const p of pairs) {
    const [device, place] = splitPlace(p.downstream);
    const key = JSON.stringify([p.kind, p.upstream, device, p.outcome, p.upToA]);
    const candidates = byJudgement.get(key);
    const group = candidates?.find((g) => sameWorking(g.working, p.working));
    if (group) {
      if (place) group.places.push(place);
      continue;
    }
    const created: SelectivityGroup = {
      kind: p.kind,
      upstream: p.upstream,
      device,
      places: place ? [place] : [],
      outcome: p.outcome,
      upToA: p.upToA,
      working: p.working,
    };
    groups.push(created);
    if (candidates) candidates.push(created);
    else byJudgement.set(key, [created]);
  }
  return groups;
}

/** "way 1", "way 2", "way 5" → "ways 1, 2, 5"; "incoming", "way 4" → "incoming; way 4"; none: "". */
export function placesWords(places: readonly string[]): string {
  const ways = places.filter((p) => p.startsWith('way ')).map((p) => p.slice(4));
  const others = places.filter((p) => !p.startsWith('way '));
  const wayWords = ways.length === 0 ? [] : [`${ways.length === 1 ? 'way' : 'ways'} ${ways.join(', ')}`];
  return [...others, ...wayWords].join('; ');
}
