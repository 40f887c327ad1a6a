import type { BoardSettings, WayInput } from '@/lib/boards/schemas';
import type { SupplyInput } from '@/lib/sizing';
import { subMainLoad } from '@/lib/supply';

/** A draft's settings and ways with what the tree gives it (lib/dal/site-supply.ts `draftTreeContext`). */
export function withTreeContext<T extends { settings: BoardSettings; ways: WayInput[] }>(
  draft: T,
  context: { supply: SupplyInput | null; subMains: Map<string, number> },
): { settings: BoardSettings; ways: WayInput[] } {
  const { supply, subMains } = context;
  return {
    settings: supply ? { ...draft.settings, supply } : draft.settings,
    ways: draft.ways.map((w) => {
      const amps = subMains.get(w.id);
      if (amps === undefined || !w.circuit) return w;
      return {
        ...w,
        circuit: { ...w.circuit, load: subMainLoad(amps, w.circuit.phases, (supply ?? draft.settings.supply).uoV) },
      };
    }),
  };
}
