import type { BoardInput } from '@/lib/sizing';

import { layoutWays, railOrder } from './layout';
import type { BoardSettings, WayInput } from './schemas';

/**
 * The engine's board input from a board's settings and ways: ways in rail order, and on
 * a three-phase board each single-pole device on the phase its position gives it.
 */
export function boardSizingInput(settings: BoardSettings, ways: readonly WayInput[]): BoardInput {
  const ordered = railOrder(ways);
  const places = new Map(layoutWays(settings.phases, ordered).map((p) => [p.id, p]));
  return {
    supply: settings.supply,
    phases: settings.phases,
    enclosureModules: settings.enclosureModules,
    incoming: settings.incoming,
    dwelling: settings.dwelling,
    conditionalRatingKa: settings.conditionalRatingKa ?? null,
    ways: ordered.map((way) => {
      const phase = places.get(way.id)?.phases;
      const onePhase = settings.phases === 3 && way.device.poles < 3 && phase?.length === 1;
      return {
        id: way.id,
        device: onePhase ? { ...way.device, phase: phase[0] } : way.device,
        circuit: way.circuit,
      };
    }),
  };
}
