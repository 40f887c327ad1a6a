import type { BoardInput, CircuitFields, CircuitSpec, DeviceOnRail } from './schemas';
import { sizeCircuit } from './size-circuit';
import type { Check, CircuitResult, ProtectiveDeviceKind } from './types';

export type Phase = 'L1' | 'L2' | 'L3';

/** Result for one way of the board, in rail order. */
export interface WayResult {
  id: string;
  /** Sizing of the way's circuit; null for a spare way or a device that feeds no circuit. */
  result: CircuitResult | null;
  /** Id of the RCD way (or the way itself for an RCBO, or 'incoming') giving RCD protection. */
  protectedBy: string | null;
}

/** One diversity rule applied, with where it comes from. */
export interface DiversityRule {
  rule: string;
  source: string;
}

export interface BoardSummary {
  connectedLoadW: number;
  /** Maximum demand after diversity, A (the most loaded phase on a three-phase board). */
  maxDemandA: number;
  diversityRules: DiversityRule[];
  phaseCurrentsA: Record<Phase, number> | null;
  /** (most loaded phase − mean) / mean × 100; null on a single-phase board or with no load. */
  imbalancePct: number | null;
  incomingCheck: Check;
  busbarCheck: Check | null;
  modulesCheck: Check;
  /** Board-level checks: incoming, busbar, modules and device poles. */
  checks: Check[];
  modulesUsed: number;
  modulesFree: number;
  enclosureModules: number;
  counts: { passes: number; nearLimit: number; fails: number; spare: number };
  rcdCoverage: Array<{ rcdId: string; wayIds: string[] }>;
}

export interface BoardResult {
  ways: WayResult[];
  summary: BoardSummary;
}

const PROTECTIVE = new Set<string>(['mcb', 'rcbo', 'fuse-bs88-2', 'fuse-bs88-3', 'fuse-bs3036']);

/** Whether a rail device protects a circuit (and so may hold one). */
export function isProtectiveDevice(kind: DeviceOnRail['kind']): kind is ProtectiveDeviceKind {
  return PROTECTIVE.has(kind);
}

/** Combine a way's circuit with the device on the rail and the RCD upstream of it. */
export function circuitForWay(
  spec: CircuitSpec,
  device: DeviceOnRail,
  upstreamRcdMa: number | null,
  boardDwelling: boolean | undefined,
): CircuitFields {
  const kind = device.kind as ProtectiveDeviceKind;
  return {
    ...spec,
    dwelling: spec.dwelling ?? boardDwelling,
    device: {
      kind,
      curve: device.curve,
      ratingA: device.ratingA ?? null,
      breakingKa: device.breakingKa,
      rcdMa: kind === 'rcbo' ? (device.rcdMa ?? null) : upstreamRcdMa,
    },
  };
}

type DiversityClass = 'lighting' | 'sockets' | 'cooker' | 'water-heater' | 'heating-power' | 'distribution';

/** Household load class of a circuit, from its use and (for fixed loads) its `serves` text. */
export function diversityClass(spec: CircuitSpec): DiversityClass {
  if (spec.use === 'lighting') return 'lighting';
  if (spec.use === 'sockets') return 'sockets';
  if (spec.use === 'distribution') return 'distribution';
  const serves = spec.serves ?? '';
  if (/cook|oven|hob/i.test(serves)) return 'cooker';
  if (/shower|instantaneous|water heater/i.test(serves)) return 'water-heater';
  return 'heating-power';
}

interface Loaded {
  id: string;
  ibA: number;
  spec: CircuitSpec;
  phases: Phase[];
}

/**
 * Diversified current of each circuit, A, and the rules used.
 * Dwellings: household allowances (common practice, UK on-site guidance): lighting 66 %;
 * sockets 100 % of the largest + 40 % of the rest; cooking 10 A + 30 % of the remainder
 * (no cooker-unit socket assumed); instantaneous water heaters 100 % + 100 % + 25 % of the
 * rest; heating and power 100 % up to 10 A + 50 % of the balance; distribution 100 %.
 * A group allowance is shared among its circuits in proportion to Ib.
 * Others: 100 % of the largest circuit + 75 % of the rest (assumption, common practice).
 */
export function applyDiversity(
  loads: Loaded[],
  dwelling: boolean,
): { amps: Map<string, number>; rules: DiversityRule[] } {
  const amps = new Map<string, number>();
  const rules: DiversityRule[] = [];
  const byIbDesc = (a: Loaded, b: Loaded) => b.ibA - a.ibA;
  if (!dwelling) {
    const sorted = [...loads].sort(byIbDesc);
    sorted.forEach((l, i) => amps.set(l.id, l.ibA * (i === 0 ? 1 : 0.75)));
    rules.push({
      rule: '100 % of the largest circuit + 75 % of every other',
      source: 'Assumption (common practice for a non-dwelling); replace with a load study where one exists',
    });
    return { amps, rules };
  }
  const groups = new Map<DiversityClass, Loaded[]>();
  for (const l of loads) {
    const k = diversityClass(l.spec);
    groups.set(k, [...(groups.get(k) ?? []), l]);
  }
  const src = 'Common practice: UK on-site guidance, household allowances for diversity';
  const share = (group: Loaded[], totalAllowed: number) => {
    const total = group.reduce((s, l) => s + l.ibA, 0);
    for (const l of group) amps.set(l.id, total > 0 ? (l.ibA / total) * totalAllowed : 0);
  };
  for (const [k, group] of groups) {
    const total = group.reduce((s, l) => s + l.ibA, 0);
    const sorted = [...group].sort(byIbDesc);
    if (k === 'lighting') {
      share(group, 0.66 * total);
      rules.push({ rule: 'Lighting: 66 % of the total demand', source: src });
    } else if (k === 'sockets') {
      sorted.forEach((l, i) => amps.set(l.id, l.ibA * (i === 0 ? 1 : 0.4)));
      rules.push({ rule: 'Socket circuits: 100 % of the largest + 40 % of every other', source: src });
    } else if (k === 'cooker') {
      share(group, Math.min(total, 10 + 0.3 * Math.max(0, total - 10)));
      rules.push({ rule: 'Cooking: 10 A + 30 % of the remainder (no socket on the control unit assumed)', source: src });
    } else if (k === 'water-heater') {
      sorted.forEach((l, i) => amps.set(l.id, l.ibA * (i < 2 ? 1 : 0.25)));
      rules.push({ rule: 'Instantaneous water heaters: 100 % of the largest + 100 % of the second + 25 % of the rest', source: src });
    } else if (k === 'heating-power') {
      share(group, Math.min(total, 10 + 0.5 * Math.max(0, total - 10)));
      rules.push({ rule: 'Heating and power: 100 % up to 10 A + 50 % of the balance', source: src });
    } else {
      share(group, total);
      rules.push({ rule: 'Distribution circuits: 100 % (the board downstream applies its own diversity)', source: 'Assumption' });
    }
  }
  if (loads.some((l) => diversityClass(l.spec) !== l.spec.use && l.spec.use === 'fixed')) {
    rules.push({ rule: 'Fixed loads classed as cooking or water heating from their "serves" text', source: 'Assumption' });
  }
  return { amps, rules };
}

const check = (code: string, ok: boolean, message: string, reference: string): Check => ({
  code,
  ok,
  message,
  reference,
});

/**
 * Size every way of a board and summarise it: connected load, maximum demand after
 * diversity, phase currents and imbalance, incoming device and busbar against the demand,
 * modules used, verdict counts and which RCD protects which ways. An RCD protects the ways
 * after it until the next RCD or main switch; an RCBO protects its own way. `input` must
 * already have been validated with `boardInputSchema`. Never throws for validated input.
 */
export function sizeBoard(input: BoardInput): BoardResult {
  const ways: WayResult[] = [];
  const loads: Loaded[] = [];
  const rcdCoverage: Array<{ rcdId: string; wayIds: string[] }> = [];
  const boardChecks: Check[] = [];
  const notes: string[] = [];
  const counts = { passes: 0, nearLimit: 0, fails: 0, spare: 0 };
  let connectedLoadW = 0;
  let modulesUsed = 0;

  // Walk the rail in order, tracking the RCD that covers the current position.
  let upstream: { id: string; ma: number } | null =
    input.incoming.kind === 'rcd' ? { id: 'incoming', ma: input.incoming.rcdMa ?? 30 } : null;
  if (upstream) rcdCoverage.push({ rcdId: upstream.id, wayIds: [] });
  for (const way of input.ways) {
    const d = way.device;
    modulesUsed += d.modules;
    if (d.kind === 'main-switch') upstream = null;
    if (d.kind === 'rcd') {
      upstream = { id: way.id, ma: d.rcdMa ?? 30 };
      rcdCoverage.push({ rcdId: way.id, wayIds: [] });
    }
    if (d.kind === 'blank') {
      // A blank is a spare way: it sits under the RCD before it, like any other way.
      counts.spare += 1;
      if (upstream) rcdCoverage[rcdCoverage.length - 1].wayIds.push(way.id);
      ways.push({ id: way.id, result: null, protectedBy: upstream?.id ?? null });
      continue;
    }
    if (!isProtectiveDevice(d.kind)) {
      ways.push({ id: way.id, result: null, protectedBy: null });
      continue;
    }
    const protectedBy = d.kind === 'rcbo' ? way.id : (upstream?.id ?? null);
    if (d.kind !== 'rcbo' && upstream) rcdCoverage[rcdCoverage.length - 1].wayIds.push(way.id);
    if (!way.circuit) {
      counts.spare += 1;
      ways.push({ id: way.id, result: null, protectedBy });
      continue;
    }
    const spec = way.circuit;
    const result = sizeCircuit({
      supply: input.supply,
      circuit: circuitForWay(spec, d, d.kind === 'rcbo' ? null : (upstream?.ma ?? null), input.dwelling),
    });
    ways.push({ id: way.id, result, protectedBy });
    if (result.verdict === 'passes') counts.passes += 1;
    else if (result.verdict === 'near-limit') counts.nearLimit += 1;
    else counts.fails += 1;

    // Connected load: known loads at their watts, socket arrangements at Ib·Uo.
    connectedLoadW +=
      spec.load.kind === 'known' ? spec.load.watts : result.ibA * input.supply.uoV;

    // Phases the circuit loads.
    let phases: Phase[] = ['L1'];
    if (input.phases === 3) {
      if (spec.phases === 3) phases = ['L1', 'L2', 'L3'];
      else if (d.phase) phases = [d.phase];
      else notes.push(`Way ${way.id}: no phase set; counted on L1.`);
      if (spec.phases === 3 && d.poles < 3) {
        boardChecks.push(
          check('poles', false, `Way ${way.id}: a three-phase circuit needs a 3- or 4-pole device.`, 'BS 7671:2018 530.3'),
        );
      }
    }
    loads.push({ id: way.id, ibA: result.ibA, spec, phases });
  }

  // Maximum demand after diversity, per phase.
  const dwelling = input.dwelling ?? false;
  const { amps, rules } = applyDiversity(loads, dwelling);
  const perPhase: Record<Phase, number> = { L1: 0, L2: 0, L3: 0 };
  for (const l of loads) for (const p of l.phases) perPhase[p] += amps.get(l.id) ?? 0;
  const three = input.phases === 3;
  const maxDemandA = three ? Math.max(perPhase.L1, perPhase.L2, perPhase.L3) : perPhase.L1;
  const mean = (perPhase.L1 + perPhase.L2 + perPhase.L3) / 3;
  const imbalancePct = three && mean > 0 ? ((maxDemandA - mean) / mean) * 100 : null;
  for (const n of notes) rules.push({ rule: n, source: 'Assumption' });

  // Incoming device, busbar and enclosure.
  const inc = input.incoming;
  const incomingOk = inc.ratingA >= maxDemandA;
  const incomingCheck = check(
    'incoming',
    incomingOk,
    `Incoming ${inc.kind} ${inc.ratingA} A ${incomingOk ? '≥' : '<'} maximum demand ${maxDemandA.toFixed(1)} A.`,
    'BS 7671:2018 311.1, 433.1.1',
  );
  const busbarCheck =
    inc.busbarRatingA === undefined
      ? null
      : check(
          'busbar',
          inc.busbarRatingA >= inc.ratingA,
          `Busbar ${inc.busbarRatingA} A ${inc.busbarRatingA >= inc.ratingA ? '≥' : '<'} incoming ${inc.ratingA} A.`,
          'BS EN 61439-3 (rated current of the assembly)',
        );
  const modulesOk = modulesUsed <= input.enclosureModules;
  const modulesCheck = check(
    'modules',
    modulesOk,
    `${modulesUsed} of ${input.enclosureModules} modules used.`,
    'Enclosure capacity',
  );

  return {
    ways,
    summary: {
      connectedLoadW,
      maxDemandA,
      diversityRules: rules,
      phaseCurrentsA: three ? perPhase : null,
      imbalancePct,
      incomingCheck,
      busbarCheck,
      modulesCheck,
      checks: [incomingCheck, ...(busbarCheck ? [busbarCheck] : []), modulesCheck, ...boardChecks],
      modulesUsed,
      modulesFree: input.enclosureModules - modulesUsed,
      enclosureModules: input.enclosureModules,
      counts,
      rcdCoverage,
    },
  };
}
