import { layoutWays } from '../boards/layout';
import { INCOMING_RCD, protectedById, rcdProtection } from '../boards/rcd-protection';
import { deviceName, wayName } from '../names';
import type { BoardInput, CircuitFields, CircuitSpec, DeviceOnRail } from './schemas';
import { BS7671, sizeValidCircuit } from './size-circuit';
import type { Check, CircuitResult, LoadType, ProtectiveDeviceKind } from './types';
import { validBoardInput } from './validate';

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
  conditionalRatingKa: number | null = null,
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
      conditionalRatingKa,
    },
  };
}

/** A diversity group: the kind of load, or distribution for a sub-main. */
type DiversityClass = LoadType | 'distribution';

/**
 * The diversity group of a circuit: distribution circuits by their use; otherwise the kind of
 * load chosen for the way. Where none was chosen it follows the use (lighting, sockets) and
 * a fixed load counts as "other" (heating and power, the more cautious allowance). Never
 * guessed from the way's free text.
 */
export function diversityClass(spec: CircuitSpec): DiversityClass {
  if (spec.use === 'distribution') return 'distribution';
  if (spec.loadType) return spec.loadType;
  if (spec.use === 'lighting') return 'lighting';
  if (spec.use === 'sockets') return 'sockets';
  return 'other';
}

/** Kinds of load that take no diversity (100 %), with where that comes from. */
const NO_DIVERSITY: Partial<Record<DiversityClass, { rule: string; source: string }>> = {
  'ev-charger': {
    rule: 'Electric vehicle chargers: 100 % (no diversity)',
    source: 'BS 7671:2018+A2:2022 722.311 (from memory): no diversity for a charging point circuit',
  },
  'storage-heating': {
    rule: 'Thermal storage space heating: 100 % (no diversity)',
    source: 'Common practice: UK on-site guidance, household allowances for diversity',
  },
  'water-heater': {
    rule: 'Thermostatically controlled water heaters: 100 % (no diversity)',
    source: 'Common practice: UK on-site guidance, household allowances for diversity',
  },
  distribution: {
    rule: 'Distribution circuits: 100 % (the board downstream applies its own diversity)',
    source: 'Assumption',
  },
};

interface Loaded {
  id: string;
  ibA: number;
  spec: CircuitSpec;
  phases: Phase[];
}

/**
 * Diversified current of each circuit, A, and the rules used, by the kind of load of each way.
 * Both kinds of premises: EV chargers (BS 7671 722.311, from memory), storage heating and
 * thermostatic water heaters take 100 %; distribution circuits 100 %.
 * Dwellings (common practice, UK on-site guidance, household allowances): lighting 66 %;
 * sockets 100 % of the largest + 40 % of the rest; cooking 10 A + 30 % of the remainder (no
 * cooker-unit socket assumed); showers (instantaneous water heaters) 100 % + 100 % + 25 % of
 * the rest; motors 100 % of the largest + 80 % of the second + 60 % of the rest (the guidance's
 * allowance for small premises, from memory); other heating and power 100 % up to 10 A + 50 %
 * of the balance. A group allowance is shared among its circuits in proportion to Ib.
 * Non-dwellings: the rest at 100 % of the largest circuit + 75 % of the others (assumption,
 * common practice).
 */
export function applyDiversity(
  loads: Loaded[],
  dwelling: boolean,
): { amps: Map<string, number>; rules: DiversityRule[] } {
  const amps = new Map<string, number>();
  const rules: DiversityRule[] = [];
  const byIbDesc = (a: Loaded, b: Loaded) => b.ibA - a.ibA;
  const groups = new Map<DiversityClass, Loaded[]>();
  const rest: Loaded[] = [];
  for (const l of loads) {
    const k = diversityClass(l.spec);
    if (NO_DIVERSITY[k] || dwelling) groups.set(k, [...(groups.get(k) ?? []), l]);
    else rest.push(l);
  }
  const src = 'Common practice: UK on-site guidance, household allowances for diversity';
  const share = (group: Loaded[], totalAllowed: number) => {
    const total = group.reduce((s, l) => s + l.ibA, 0);
    for (const l of group) amps.set(l.id, total > 0 ? (l.ibA / total) * totalAllowed : 0);
  };
  for (const [k, group] of groups) {
    const total = group.reduce((s, l) => s + l.ibA, 0);
    const sorted = [...group].sort(byIbDesc);
    const fixed = NO_DIVERSITY[k];
    if (fixed) {
      share(group, total);
      rules.push(fixed);
    } else if (k === 'lighting') {
      share(group, 0.66 * total);
      rules.push({ rule: 'Lighting: 66 % of the total demand', source: src });
    } else if (k === 'sockets') {
      sorted.forEach((l, i) => amps.set(l.id, l.ibA * (i === 0 ? 1 : 0.4)));
      rules.push({ rule: 'Socket circuits: 100 % of the largest + 40 % of every other', source: src });
    } else if (k === 'cooker') {
      share(group, Math.min(total, 10 + 0.3 * Math.max(0, total - 10)));
      rules.push({
        rule: 'Cooking: 10 A + 30 % of the remainder (no socket on the control unit assumed)',
        source: src,
      });
    } else if (k === 'shower') {
      sorted.forEach((l, i) => amps.set(l.id, l.ibA * (i < 2 ? 1 : 0.25)));
      rules.push({
        rule: 'Showers (instantaneous water heaters): 100 % of the largest + 100 % of the second + 25 % of the rest',
        source: src,
      });
    } else if (k === 'motor') {
      sorted.forEach((l, i) => amps.set(l.id, l.ibA * (i === 0 ? 1 : i === 1 ? 0.8 : 0.6)));
      rules.push({
        rule: 'Motors: 100 % of the largest + 80 % of the second + 60 % of the rest',
        source: `${src} (small premises; from memory)`,
      });
    } else {
      share(group, Math.min(total, 10 + 0.5 * Math.max(0, total - 10)));
      rules.push({ rule: 'Other heating and power: 100 % up to 10 A + 50 % of the balance', source: src });
    }
  }
  if (rest.length > 0) {
    [...rest].sort(byIbDesc).forEach((l, i) => amps.set(l.id, l.ibA * (i === 0 ? 1 : 0.75)));
    rules.push({
      rule: 'Other circuits: 100 % of the largest + 75 % of every other',
      source: 'Assumption (common practice for a non-dwelling); replace with a load study where one exists',
    });
  }
  return { amps, rules };
}

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

const check = (code: string, ok: boolean, message: string, reference: string): Check => ({
  code,
  ok,
  message,
  reference,
});

/**
 * Size every way of a board and summarise it: connected load, maximum demand after
 * diversity, phase currents and imbalance, incoming device and busbar against the demand,
 * modules used, verdict counts and which RCD protects which ways (the one rule of
 * lib/boards/rcd-protection.ts, which the editor and the schedule use too). The input is
 * validated here (a SizingInputError names each bad field; see `parseBoardInput`). Messages
 * name ways by their way number (lib/boards/layout.ts), never by id. Never throws for a
 * valid input.
 */
export function sizeBoard(raw: BoardInput): BoardResult {
  const input = validBoardInput(raw);
  // Way numbers as the rail gives them (the ways are in rail order).
  const labels = new Map(
    layoutWays(
      input.phases,
      input.ways.map((w, position) => ({ id: w.id, rail: 0, position, device: w.device })),
    ).map((p) => [p.id, p.label]),
  );
  const nameOf = (id: string) => wayName(labels.get(id) ?? '?');
  const ways: WayResult[] = [];
  const loads: Loaded[] = [];
  const boardChecks: Check[] = [];
  const notes: string[] = [];
  const counts = { passes: 0, nearLimit: 0, fails: 0, spare: 0 };
  let connectedLoadW = 0;
  let modulesUsed = 0;

  // Which RCD protects each way: the one rule the editor and the schedule use as well.
  const protection = rcdProtection(
    input.ways.map((w, position) => ({ id: w.id, rail: 0, position, device: w.device })),
    input.incoming.kind === 'rcd',
  );
  const rcdMa = new Map<string, number>([[INCOMING_RCD, input.incoming.rcdMa ?? 30]]);
  const coverage = new Map<string, string[]>();
  if (input.incoming.kind === 'rcd') coverage.set(INCOMING_RCD, []);
  for (const way of input.ways) {
    if (way.device.kind !== 'rcd') continue;
    rcdMa.set(way.id, way.device.rcdMa ?? 30);
    coverage.set(way.id, []);
  }
  const rcdCoverage = [...coverage].map(([rcdId, wayIds]) => ({ rcdId, wayIds }));

  for (const way of input.ways) {
    const d = way.device;
    modulesUsed += d.modules;
    const protectedBy = protectedById(way.id, protection.get(way.id) ?? null);
    // An RCD's way (not an RCBO's own) lists the ways it covers
    if (protectedBy !== null && protectedBy !== way.id) coverage.get(protectedBy)?.push(way.id);
    if (d.kind === 'blank') {
      // A blank is a spare way: it sits under the RCD before it, like any other way.
      counts.spare += 1;
      ways.push({ id: way.id, result: null, protectedBy });
      continue;
    }
    if (!isProtectiveDevice(d.kind)) {
      ways.push({ id: way.id, result: null, protectedBy: null });
      continue;
    }
    if (!way.circuit) {
      counts.spare += 1;
      ways.push({ id: way.id, result: null, protectedBy });
      continue;
    }
    const spec = way.circuit;
    const result = sizeValidCircuit({
      supply: input.supply,
      circuit: circuitForWay(
        spec,
        d,
        d.kind === 'rcbo' || protectedBy === null ? null : (rcdMa.get(protectedBy) ?? null),
        input.dwelling,
        input.conditionalRatingKa ?? null,
      ),
    });
    ways.push({ id: way.id, result, protectedBy });
    if (result.verdict === 'passes') counts.passes += 1;
    else if (result.verdict === 'near-limit') counts.nearLimit += 1;
    else counts.fails += 1;

    // Connected load: known loads at their watts, socket arrangements at Ib·Uo.
    connectedLoadW += spec.load.kind === 'known' ? spec.load.watts : result.ibA * input.supply.uoV;

    // Phases the circuit loads.
    let phases: Phase[] = ['L1'];
    if (input.phases === 3) {
      if (spec.phases === 3) phases = ['L1', 'L2', 'L3'];
      else if (d.phase) phases = [d.phase];
      else notes.push(`${capitalise(nameOf(way.id))}: no phase set; counted on L1.`);
      if (spec.phases === 3 && d.poles < 3) {
        boardChecks.push(
          check(
            'poles',
            false,
            `${capitalise(nameOf(way.id))}: a three-phase circuit needs a 3- or 4-pole device.`,
            `${BS7671} 530.3`,
          ),
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
    `${deviceName({ kind: inc.kind, ratingA: inc.ratingA, rcdMa: inc.rcdMa })} (incoming) ${incomingOk ? '≥' : '<'} maximum demand ${maxDemandA.toFixed(1)} A.`,
    `${BS7671} 311.1, 433.1.1`,
  );
  // A main switch drawn on the rail is the incoming main switch of the settings, entered twice:
  // the record must show one device (common practice: an inspector returns a schedule whose rail
  // shows a 125 A main switch where the settings size the board's 161 A demand against 200 A).
  if (inc.kind === 'main-switch') {
    for (const way of input.ways) {
      // A drawn main switch with no rating given claims nothing to disagree with
      if (way.device.kind !== 'main-switch' || (way.device.ratingA ?? inc.ratingA) === inc.ratingA) continue;
      boardChecks.push(
        check(
          'incoming-drawn',
          false,
          `The main switch drawn on the rail is ${way.device.ratingA} A but the incoming main switch in the board's settings is ${inc.ratingA} A: they are one device, so make them agree.`,
          'Board record: one incoming device (common practice)',
        ),
      );
    }
  }
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
