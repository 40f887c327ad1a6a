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

/**
 * A board's selectivity pairs grouped by what was judged: the same device above, the same kind
 * of device below, the same outcome and the same working. A board of 36 B16 ways below one
 * sub-main is one judgement with 36 places, printed once with its working rather than 36 times.
 */
export function groupSelectivity(pairs: readonly SelectivityPair[]): SelectivityGroup[] {
  const groups = new Map<string, SelectivityGroup>();
  for (const p of pairs) {
    const [device, place] = splitPlace(p.downstream);
    const key = JSON.stringify([p.kind, p.upstream, device, p.outcome, p.upToA, p.working]);
    const group = groups.get(key);
    if (group) {
      if (place) group.places.push(place);
    } else {
      groups.set(key, {
        kind: p.kind,
        upstream: p.upstream,
        device,
        places: place ? [place] : [],
        outcome: p.outcome,
        upToA: p.upToA,
        working: p.working,
      });
    }
  }
  return [...groups.values()];
}

/** "way 1", "way 2", "way 5" → "ways 1, 2, 5"; "incoming", "way 4" → "incoming; way 4"; none: "". */
export function placesWords(places: readonly string[]): string {
  const ways = places.filter((p) => p.startsWith('way ')).map((p) => p.slice(4));
  const others = places.filter((p) => !p.startsWith('way '));
  const wayWords = ways.length === 0 ? [] : [`${ways.length === 1 ? 'way' : 'ways'} ${ways.join(', ')}`];
  return [...others, ...wayWords].join('; ');
}
