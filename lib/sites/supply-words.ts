/**
 * The supply a board is sized with, in words, for the screens that state it beside the board
 * (the editor's drawn board, the review page): the typed values for a board outside a tree; for
 * a board fed from another board, the Zdb and PFC carried down to it, marked as carried; for a
 * board fed from the site's origin, the origin's values, marked so. A feed the tree could not
 * follow says so (the reason is the title, and the editor's Supply panel). Browser-safe.
 */
import type { SupplyInput } from '@/lib/sizing';
import { fedFromWords } from '@/lib/names';

import type { DerivedSupply } from './tree-types';

/** Carried values in words, at the same precision on every screen and print that states them. */
export const ohm = (x: number) => `${x.toFixed(3)} Ω`;
export const ka = (x: number) => `${x.toFixed(2)} kA`;
export const pct = (x: number) => `${x.toFixed(2)} %`;
export const amps = (x: number) => `${x.toFixed(1)} A`;

export type SupplyWords = {
  supply: SupplyInput;
  /** "Ze 0.35 Ω · PFC 1.5 kA", or "Zdb 0.444 Ω (carried) · PFC 0.99 kA (carried)". */
  values: string;
  /** Where the values come from, for a tooltip; none for typed values. */
  title: string | undefined;
};

/** The supply in use: the typed one, or what the site's tree gives the board (`derivedSupply`). */
export function supplyInUseWords(typed: SupplyInput, derived: DerivedSupply | null | undefined): SupplyWords {
  if (!derived) {
    return { supply: typed, values: `Ze ${typed.zeOhm} Ω · PFC ${typed.pfcKa} kA`, title: undefined };
  }
  const s = derived.supply;
  if (derived.from === 'way' && !derived.problem) {
    return {
      supply: s,
      values: `Zdb ${ohm(s.zeOhm)} (carried) · PFC ${ka(s.pfcKa)} (carried)`,
      title: `Carried down from ${fedFromWords(derived.fedFrom)}; the board’s typed Ze and PFC are not used.`,
    };
  }
  const mark = derived.from === 'way' ? '(not carried: see Supply)' : '(site origin)';
  return {
    supply: s,
    values: `Ze ${ohm(s.zeOhm)} ${mark} · PFC ${ka(s.pfcKa)} ${mark}`,
    title: derived.problem ?? 'The site’s origin; the board’s typed Ze and PFC are not used.',
  };
}
