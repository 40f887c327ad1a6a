import { applyDiversity, designCurrent, isProtectiveDevice, type BoardInput, type Phase } from '@/lib/sizing';

/**
 * A board's maximum demand after diversity, A (the most loaded phase on a three-phase board),
 * from the engine's own pieces, without sizing every circuit: each way's design current
 * (`designCurrent`, the engine's step 1), the phases it loads as `sizeBoard` places them, and
 * the engine's `applyDiversity`. Equal to `sizeBoard(input).summary.maxDemandA` (a property test
 * holds it so); the supply tree's bottom-up pass needs only this, at a fraction of the cost.
 */
export function boardMaxDemand(input: BoardInput): number {
  const loads: Parameters<typeof applyDiversity>[0] = [];
  for (const way of input.ways) {
    const d = way.device;
    if (!isProtectiveDevice(d.kind) || !way.circuit) continue;
    const spec = way.circuit;
    const ibA = designCurrent(spec.load, spec.phases, input.supply.uoV, d.kind);
    let phases: Phase[] = ['L1'];
    if (input.phases === 3) {
      if (spec.phases === 3) phases = ['L1', 'L2', 'L3'];
      else if (d.phase) phases = [d.phase];
    }
    loads.push({ id: way.id, ibA, spec, phases });
  }
  const { amps } = applyDiversity(loads, input.dwelling ?? false);
  const perPhase: Record<Phase, number> = { L1: 0, L2: 0, L3: 0 };
  for (const l of loads) for (const p of l.phases) perPhase[p] += amps.get(l.id) ?? 0;
  return input.phases === 3 ? Math.max(perPhase.L1, perPhase.L2, perPhase.L3) : perPhase.L1;
}
