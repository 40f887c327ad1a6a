import {
  BS7671,
  conductorResistance20,
  lineVoltage,
  CABLE_PROPERTIES,
  reviseBoardInput,
  sizeBoard,
  type BoardInput,
  type BoardResult,
  type CircuitResult,
  type Phase,
  type SupplyInput,
  type Verdict,
  type EngineWayInput,
} from '@/lib/sizing';
import { ARMOUR_TEMPERATURE_FACTOR, ARMOURED_4E4, SWA_ARMOUR } from '@/lib/sizing/tables/armoured-4e4';
import { OPERATING_TEMPERATURE_FACTOR } from '@/lib/sizing/tables/conductor-resistance';
import { CABLE_SHORT_NAMES, deviceName, wayName } from '@/lib/names';

import { boardMaxDemand } from './max-demand';
import { overcurrentSelectivity, rcdSelectivity, type OvercurrentDevice } from './selectivity';
import type {
  CarriedFaultCurrent,
  SelectivityPair,
  SiteBoardInput,
  SiteBoardResult,
  SiteResult,
  SiteTreeInput,
  SubMainCurrent,
} from './types';
import { validateTree } from './validate-tree';

const f = (x: number, d = 3) => (Number.isFinite(x) ? x.toFixed(d) : String(x));
const SRC_R20 = 'IEC 60228 (conductor resistance at 20 °C)';
const SRC_M = 'BS 7671 Appendix 3 practice (× 1.20 for 70 °C thermoplastic, × 1.28 for 90 °C thermosetting)';
const SRC_METHOD = 'Site-supply method (carried values)';

/**
 * The load a sub-main's circuit is sized with: a known load whose design current is `amps`
 * (P = Ib·Uo single-phase, Ib·√3·UL three-phase, power factor 1), so the engine's own design
 * current step gives Ib back.
 */
export function subMainLoad(amps: number, phases: 1 | 3, uoV: number) {
  const watts = phases === 3 ? amps * Math.sqrt(3) * lineVoltage(uoV) : amps * uoV;
  return { kind: 'known' as const, watts, powerFactor: 1 };
}

/** The board with every feeding way's load set to the design current of the board it feeds. */
function withSubMainLoads(
  board: BoardInput,
  currents: ReadonlyMap<string, number>,
  supply: SupplyInput,
  parse = true,
): BoardInput {
  const ways: EngineWayInput[] = board.ways.map((w) => {
    const amps = currents.get(w.id);
    if (amps === undefined || !w.circuit) return w;
    return { ...w, circuit: { ...w.circuit, load: subMainLoad(amps, w.circuit.phases, supply.uoV) } };
  });
  // Unparsed only for the demand pass: the board was parsed and only known loads changed. Else
  // only the supply and the sub-mains' ways are validated again (the rest was, with the board).
  return parse ? reviseBoardInput(board, supply, ways) : { ...board, supply, ways };
}

/** The worst verdict of a sized board: its ways and board checks, raised to near limit by advisory selectivity. */
export function worstVerdictOf(sizing: BoardResult, selectivity: readonly SelectivityPair[] = []): Verdict {
  const c = sizing.summary.counts;
  if (c.fails > 0 || sizing.summary.checks.some((k) => !k.ok)) return 'fails';
  if (c.nearLimit > 0 || selectivity.some((p) => p.advisory)) return 'near-limit';
  return 'passes';
}

/** What a sizing gave, in brief: each way's verdict (by way id) and the board's worst verdict without selectivity. */
export type SizingOutcome = { verdicts: Record<string, Verdict>; worst: Verdict };

/** A sizing's outcome (stored beside it, so a re-size compares verdicts without reading it whole). */
export function sizingOutcome(sizing: BoardResult): SizingOutcome {
  const verdicts: Record<string, Verdict> = {};
  for (const w of sizing.ways) if (w.result) verdicts[w.id] = w.result.verdict;
  return { verdicts, worst: worstVerdictOf(sizing, []) };
}

/** Resistance per metre of the cpc at 20 °C, Ω/m: a copper core, or the armour. */
function cpcR20(r: CircuitResult, phases: 1 | 3): number | null {
  if (r.csaMm2 === null || r.cpcMm2 === null) return null;
  if (r.cpcKind !== 'armour') return conductorResistance20(r.cpcMm2);
  const i = (ARMOURED_4E4.sizesMm2 as readonly number[]).indexOf(r.csaMm2);
  return i < 0 ? null : SWA_ARMOUR[phases === 3 ? 4 : 2].r20MohmPerM[i] / 1000;
}

/** The devices of a board that an overcurrent judgement takes, with their words and way. */
function overcurrentDevicesOf(
  board: BoardInput,
  sizing: BoardResult,
  labels: ReadonlyMap<string, string | null>,
): Array<{ device: OvercurrentDevice; words: string; wayId: string | null }> {
  const out: Array<{ device: OvercurrentDevice; words: string; wayId: string | null }> = [];
  const inc = board.incoming;
  if (inc.kind === 'mcb' || inc.kind === 'fuse-bs88-2') {
    out.push({
      device: { kind: inc.kind, curve: null, inA: inc.ratingA },
      words: `${deviceName({ kind: inc.kind, ratingA: inc.ratingA })}, incoming`,
      wayId: null,
    });
  }
  const results = new Map(sizing.ways.map((w) => [w.id, w.result]));
  for (const w of board.ways) {
    const d = w.device;
    if (d.kind !== 'mcb' && d.kind !== 'rcbo' && !d.kind.startsWith('fuse-')) continue;
    const inA = d.ratingA ?? results.get(w.id)?.inA ?? null;
    if (inA === null) continue;
    const label = labels.get(w.id) ?? null;
    out.push({
      device: { kind: d.kind as OvercurrentDevice['kind'], curve: d.curve ?? null, inA },
      words: `${deviceName(d, inA)}${label ? `, ${wayName(label)}` : ''}`,
      wayId: w.id,
    });
  }
  return out;
}

/** The RCDs of a board (incoming, RCD ways, RCBOs), with their residual currents. */
function rcdsOf(board: BoardInput, labels: ReadonlyMap<string, string | null>) {
  const out: Array<{ rcdMa: number; words: string; wayId: string | null }> = [];
  if (board.incoming.kind === 'rcd') {
    const ma = board.incoming.rcdMa ?? 30;
    out.push({ rcdMa: ma, words: `RCD ${ma} mA, incoming`, wayId: null });
  }
  for (const w of board.ways) {
    if (w.device.kind !== 'rcd' && w.device.kind !== 'rcbo') continue;
    const ma = w.device.rcdMa ?? 30;
    const label = labels.get(w.id) ?? null;
    out.push({ rcdMa: ma, words: `${deviceName(w.device)}${label ? `, ${wayName(label)}` : ''}`, wayId: w.id });
  }
  return out;
}

/** The residual current of the RCD protecting a way on a sized board, mA, or null. */
function rcdAbove(board: BoardInput, sizing: BoardResult, wayId: string): number | null {
  const by = sizing.ways.find((w) => w.id === wayId)?.protectedBy ?? null;
  if (by === null) return null;
  if (by === 'incoming') return board.incoming.rcdMa ?? 30;
  const dev = board.ways.find((w) => w.id === by)?.device;
  return dev ? (dev.rcdMa ?? 30) : null;
}

interface Cold {
  /** Earth fault loop impedance with cold conductors, Ω (Ze + Σ (r_L + r_PE)·L at 20 °C). */
  zColdOhm: number;
}

/**
 * Carry the supply down a site's tree and size every board with it, by these rules (the tests
 * cite them by number, "sizeSite rule n"):
 * 1. Zdb = Zdb(above) + R1+R2 of the sub-main (at its operating temperature); Zdb = Ze at a board
 *    fed from the origin.
 * 2. Prospective fault current, cold conductors, resistive only (reactance neglected, common
 *    practice for small installations): Zsrc = Uo / Ipf(above); single-phase Uo / (Zsrc + (r_L + r_N)·L),
 *    three-phase Uo / (Zsrc + r_L·L); the earth fault current Uo / Zdb(cold), never above
 *    Ipf(above); the larger of the two.
 * 3. Voltage drop used above: the sum of the sub-mains' own voltage drops (% of their nominal
 *    voltage) at their design currents; every way below is checked against the origin limit less it.
 * 4. The sub-main's design current: the board's maximum demand after diversity (the engine's own,
 *    most loaded phase on a three-phase board), or the designer's figure with a reason.
 * 5. Selectivity of the sub-main's device against every device on the board it feeds (advisory).
 * 6. Each board sized by `sizeBoard` with the carried values as its supply.
 * Validates first (a SiteTreeError names each problem and the boards concerned). Pure.
 */
export function sizeSite(input: SiteTreeInput): SiteResult {
  const tree = validateTree(input);
  const { origin } = input;
  const uoV = origin.uoV;

  // Bottom-up: each board's maximum demand (it depends only on the loads, not on the supply
  // values carried down), and so each sub-main's design current; the engine's own design
  // current and diversity, without sizing every circuit (see boardMaxDemand).
  const originSupply: SupplyInput = {
    earthing: origin.earthing,
    uoV,
    zeOhm: origin.zeOhm,
    pfcKa: origin.pfcKa,
    source: origin.source,
  };
  const subMainA = new Map<string, Map<string, number>>(); // parent board → (way → amps)
  const demand = new Map<string, { maxDemandA: number; amps: number }>();
  for (const b of [...tree.order].reverse()) {
    if (b.feed.from !== 'way') continue;
    const parsed = tree.parsed.get(b.id)!;
    const maxDemandA = boardMaxDemand(withSubMainLoads(parsed, subMainA.get(b.id) ?? new Map(), originSupply, false));
    const amps = b.feed.designCurrentOverride?.amps ?? maxDemandA;
    demand.set(b.id, { maxDemandA, amps });
    const m = subMainA.get(b.feed.boardId) ?? new Map<string, number>();
    m.set(b.feed.wayId, amps);
    subMainA.set(b.feed.boardId, m);
  }

  // Top-down: carry the values and size each board with them.
  const results = new Map<string, SiteBoardResult>();
  const cold = new Map<string, Cold>();
  const out: SiteBoardResult[] = [];
  for (const b of tree.order) {
    const parsed = tree.parsed.get(b.id)!;
    const r = b.feed.from === 'origin' ? rootBoard(b, input) : childBoard(b, results.get(b.feed.boardId)!);
    if (r.result.supply) {
      const sizedInput = withSubMainLoads(parsed, subMainA.get(b.id) ?? new Map(), r.result.supply);
      const sizing = sizeBoard(sizedInput);
      r.result.sizedInput = sizedInput;
      r.result.sizing = sizing;
      if (b.feed.from === 'way') {
        const parent = results.get(b.feed.boardId)!;
        r.result.selectivity = selectivityFor(b, parent, sizedInput, sizing, (r.result.pfc?.value ?? 0) * 1000);
      }
      r.result.worstVerdict = worstVerdictOf(sizing, r.result.selectivity);
    }
    if (r.cold) cold.set(b.id, r.cold);
    results.set(b.id, r.result);
    out.push(r.result);
  }
  return { siteId: input.siteId, origin, boards: out };

  function rootBoard(b: SiteBoardInput, site: SiteTreeInput): { result: SiteBoardResult; cold: Cold | null } {
    const o = site.origin;
    const res = unsizedBoard(b, 0);
    res.zdb = {
      value: o.zeOhm,
      working: {
        text: `Fed from the origin: Zdb = Ze = ${f(o.zeOhm)} Ω, as given for the supply.`,
        steps: [`Zdb = Ze = ${f(o.zeOhm)} Ω`],
        sources: [`${SRC_METHOD}, rule 1`],
      },
    };
    const efKa = o.zeOhm > 0 ? Math.min(o.pfcKa, uoV / o.zeOhm / 1000) : o.pfcKa;
    res.pfc = {
      value: o.pfcKa,
      shortCircuitKa: o.pfcKa,
      earthFaultKa: efKa,
      working: {
        text: `Fed from the origin: the prospective fault current given for the supply, ${f(o.pfcKa, 2)} kA.`,
        steps: [
          `Ipf = ${f(o.pfcKa, 2)} kA (origin)`,
          `Earth fault Uo / Ze = ${uoV} / ${f(o.zeOhm)} = ${f(uoV / Math.max(o.zeOhm, 1e-9) / 1000, 2)} kA, never above the origin's`,
        ],
        sources: [`${SRC_METHOD}, rule 2`],
      },
    };
    res.vdUsed = {
      value: 0,
      working: {
        text: 'Fed from the origin: no sub-main above, so the whole limit is left for the final circuits.',
        steps: ['0 %'],
        sources: [`${SRC_METHOD}, rule 3`],
      },
    };
    res.supply = { ...originSupply };
    return { result: res, cold: { zColdOhm: o.zeOhm } };
  }

  function childBoard(b: SiteBoardInput, parent: SiteBoardResult): { result: SiteBoardResult; cold: Cold | null } {
    if (b.feed.from !== 'way') throw new Error('unreachable');
    const feed = b.feed;
    const res = unsizedBoard(b, parent.depth + 1);
    const parentInput = parent.sizedInput ?? tree.parsed.get(parent.boardId)!;
    const way = parentInput.ways.find((w) => w.id === feed.wayId)!;
    const spec = way.circuit!;
    const label = tree.labels.get(parent.boardId)?.get(way.id) ?? null;
    const wr = parent.sizing?.ways.find((w) => w.id === way.id)?.result ?? null;
    const wayWords = label ? wayName(label) : 'the feeding way';

    res.fedFrom = {
      boardId: parent.boardId,
      boardName: parent.name,
      wayId: way.id,
      wayLabel: label,
      device: deviceName(way.device, wr?.inA ?? null),
      cable: `${wr?.csaMm2 ?? spec.csaMm2 ?? '?'} mm² ${CABLE_SHORT_NAMES[spec.cable]}, ${spec.lengthM} m, reference method ${spec.method}`,
    };
    // A single-phase board on a three-phase board takes the phase of its way.
    if (b.board.phases === 1 && parentInput.phases === 3) {
      res.phase = way.device.phase ?? layoutPhase(parent.boardId, way.id);
    }
    const d = demand.get(b.id)!;
    const ov = feed.designCurrentOverride ?? null;
    const sub: SubMainCurrent = {
      value: d.amps,
      maxDemandA: d.maxDemandA,
      override: ov,
      working: {
        text: ov
          ? `${f(ov.amps, 1)} A, set by the designer: ${ov.reason} (the board's maximum demand after diversity is ${f(d.maxDemandA, 1)} A).`
          : `The maximum demand of ${b.name} after diversity${b.board.phases === 3 ? ', on its most loaded phase' : ''}: ${f(d.maxDemandA, 1)} A.`,
        steps: [`Ib of the sub-main = ${f(d.amps, 2)} A`],
        sources: [`${SRC_METHOD}, rule 4`, 'The board’s diversity rules (see its maximum demand)'],
      },
    };
    res.subMainCurrent = sub;

    const pCold = cold.get(parent.boardId);
    if (!parent.supply || !parent.zdb || !parent.pfc || !parent.vdUsed || !pCold) {
      res.problem = `${parent.name} has no carried values, so none can be carried to ${b.name}.`;
      return { result: res, cold: null };
    }
    if (!wr || wr.csaMm2 === null || wr.r1r2Ohm === null || wr.vdPct === null) {
      res.problem = `The sub-main (${wayWords} of ${parent.name}) has no cable size the engine could check, so nothing can be carried to ${b.name}: see that way's checks.`;
      return { result: res, cold: null };
    }
    const L = spec.lengthM;
    const rL = conductorResistance20(wr.csaMm2)!;
    const rPE = cpcR20(wr, spec.phases);
    const m = OPERATING_TEMPERATURE_FACTOR[CABLE_PROPERTIES[spec.cable].maxTempC];
    const armour = wr.cpcKind === 'armour';

    // Rule 1: Zdb.
    const zdb = parent.zdb.value + wr.r1r2Ohm;
    res.zdb = {
      value: zdb,
      working: {
        text: `Zdb = Zdb of ${parent.name} ${f(parent.zdb.value)} Ω + R1+R2 of the sub-main ${f(wr.r1r2Ohm)} Ω = ${f(zdb)} Ω.`,
        steps: [
          armour
            ? `R1+R2 = (r_L ${f(rL * 1000, 3)} mΩ/m × ${m.toFixed(2)} + armour ${f((rPE ?? 0) * 1000, 3)} mΩ/m × ${ARMOUR_TEMPERATURE_FACTOR}) × ${L} m = ${f(wr.r1r2Ohm)} Ω`
            : `R1+R2 = (r_L ${f(rL * 1000, 3)} + r_PE ${f((rPE ?? 0) * 1000, 3)} mΩ/m) × ${L} m × ${m.toFixed(2)} = ${f(wr.r1r2Ohm)} Ω`,
          `Zdb = ${f(parent.zdb.value)} + ${f(wr.r1r2Ohm)} = ${f(zdb)} Ω`,
        ],
        sources: [
          `${SRC_METHOD}, rule 1`,
          SRC_R20,
          SRC_M,
          ...(armour ? ['BS 5467 armour resistance (see the armoured cable table)'] : []),
        ],
      },
    };

    // Rule 2: prospective fault current, cold, resistive only.
    const ipfUpA = parent.pfc.value * 1000;
    const zsrc = uoV / ipfUpA;
    const three = spec.phases === 3;
    const scLoop = three ? rL * L : 2 * rL * L;
    const scA = uoV / (zsrc + scLoop);
    const zCold = pCold.zColdOhm + (rL + (rPE ?? rL)) * L;
    const efA = Math.min(ipfUpA, uoV / zCold);
    const pfcA = Math.max(scA, efA);
    // Never above the board above: physics says so; the cap only absorbs rounding of A ↔ kA.
    const capKa = (a: number) => Math.min(parent.pfc!.value, a / 1000);
    const pfc: CarriedFaultCurrent = {
      value: capKa(pfcA),
      shortCircuitKa: capKa(scA),
      earthFaultKa: capKa(efA),
      working: {
        text: `Ipf = the larger of the ${three ? 'three-phase' : 'line–neutral'} short-circuit current ${f(scA / 1000, 2)} kA and the earth fault current ${f(efA / 1000, 2)} kA = ${f(pfcA / 1000, 2)} kA (cold conductors; resistance only, reactance neglected, common practice for small cable sizes).`,
        steps: [
          `Zsrc = Uo / Ipf of ${parent.name} = ${uoV} / ${f(ipfUpA, 0)} = ${f(zsrc, 4)} Ω`,
          three
            ? `Three-phase: ${uoV} / (${f(zsrc, 4)} + r_L ${f(rL * 1000, 3)} mΩ/m × ${L} m) = ${f(scA, 0)} A`
            : `Single-phase: ${uoV} / (${f(zsrc, 4)} + (r_L + r_N) ${f(2 * rL * 1000, 3)} mΩ/m × ${L} m) = ${f(scA, 0)} A`,
          `Earth fault: ${uoV} / Zdb cold ${f(zCold, 4)} Ω = ${f(uoV / zCold, 0)} A${uoV / zCold > ipfUpA ? `, never above ${parent.name}'s ${f(ipfUpA, 0)} A` : ''}`,
        ],
        sources: [`${SRC_METHOD}, rule 2`, SRC_R20, 'Common practice: neutral the same size as the line conductor'],
      },
    };
    res.pfc = pfc;

    // Rule 3: voltage drop used above.
    const used = parent.vdUsed.value + wr.vdPct;
    res.vdUsed = {
      value: used,
      working: {
        text: `${f(used, 2)} % used above ${b.name}: ${f(parent.vdUsed.value, 2)} % above ${parent.name} and ${f(wr.vdPct, 2)} % in the sub-main at ${f(wr.ibA, 1)} A.`,
        steps: [
          `Sub-main: ${f(wr.vdV ?? 0, 2)} V of ${three ? `${lineVoltage(uoV)} V` : `${uoV} V`} = ${f(wr.vdPct, 3)} %`,
          `${f(parent.vdUsed.value, 3)} + ${f(wr.vdPct, 3)} = ${f(used, 3)} %`,
        ],
        sources: [`${SRC_METHOD}, rule 3`, `${BS7671} Appendix 4 Table 4Ab (the limits run from the origin)`],
      },
    };

    res.supply = {
      earthing: origin.earthing,
      uoV,
      zeOhm: zdb,
      pfcKa: pfc.value,
      source: origin.source,
      vdUsedPct: used,
    };
    return { result: res, cold: { zColdOhm: zCold } };
  }

  function selectivityFor(
    b: SiteBoardInput,
    parent: SiteBoardResult,
    board: BoardInput,
    sizing: BoardResult,
    faultA: number,
  ): SelectivityPair[] {
    if (b.feed.from !== 'way' || !parent.sizedInput || !parent.sizing) return [];
    const feed = b.feed;
    const way = parent.sizedInput.ways.find((w) => w.id === feed.wayId)!;
    const wr = parent.sizing.ways.find((w) => w.id === way.id)?.result ?? null;
    const labels = tree.labels.get(b.id)!;
    const pairs: SelectivityPair[] = [];
    const upInA = way.device.ratingA ?? wr?.inA ?? null;
    if (upInA !== null) {
      const up: OvercurrentDevice = {
        kind: way.device.kind as OvercurrentDevice['kind'],
        curve: way.device.curve ?? null,
        inA: upInA,
      };
      const upWords = deviceName(way.device, upInA);
      for (const down of overcurrentDevicesOf(board, sizing, labels)) {
        const j = overcurrentSelectivity(up, down.device, faultA);
        pairs.push({
          kind: 'overcurrent',
          upstream: upWords,
          downstream: down.words,
          downstreamWayId: down.wayId,
          ...j,
          advisory: j.outcome === 'not-selective' || j.outcome === 'selective-up-to',
        });
      }
    }
    const upRcdMa = rcdAbove(parent.sizedInput, parent.sizing, way.id);
    if (upRcdMa !== null) {
      const timeDelayed = feed.upstreamRcdTimeDelayed ?? false;
      for (const down of rcdsOf(board, labels)) {
        const j = rcdSelectivity({ rcdMa: upRcdMa, timeDelayed }, down);
        pairs.push({
          kind: 'residual-current',
          upstream: `RCD ${upRcdMa} mA${timeDelayed ? ' time-delayed' : ''} protecting the sub-main`,
          downstream: down.words,
          downstreamWayId: down.wayId,
          ...j,
          advisory: j.outcome !== 'selective',
        });
      }
    }
    return pairs;
  }

  /** The phase a single-pole way sits on, from its printed reference ("3L2" → L2). */
  function layoutPhase(boardId: string, wayId: string): Phase {
    const m = /L([123])$/.exec(tree.labels.get(boardId)?.get(wayId) ?? '');
    return m ? (`L${m[1]}` as Phase) : 'L1';
  }
}

/** A board's entry with nothing carried to it yet (or ever: `problem` says why not). */
export function unsizedBoard(
  b: Pick<SiteBoardInput, 'id' | 'name'>,
  depth: number,
  problem: string | null = null,
): SiteBoardResult {
  return {
    boardId: b.id,
    name: b.name,
    depth,
    fedFrom: null,
    phase: null,
    zdb: null,
    pfc: null,
    vdUsed: null,
    subMainCurrent: null,
    selectivity: [],
    supply: null,
    sizedInput: null,
    sizing: null,
    worstVerdict: null,
    problem,
  };
}
