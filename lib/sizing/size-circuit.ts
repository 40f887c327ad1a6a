import { chooseCableSize, type SizeEvaluation, type SizeEvaluator } from './cable-selection';
import { chooseRating, designCurrent } from './design-current';
import { correctionFactors, requiredTabulatedCurrent } from './factors';
import { loopImpedance } from './loop-impedance';
import {
  additionalRcdReasons,
  type DeviceFacts,
  faultEnergy,
  kFactor,
  maxZs,
  minimumCpc,
  requiredDisconnectionTime,
} from './protection';
import type { CircuitInput } from './schemas';
import { DEFAULT_BREAKING_KA } from './tables/breaking-capacity';
import { CABLE_PROPERTIES, type CableRowData, cableRows, methodsFor } from './tables/cables';
import { SOCKET_ARRANGEMENTS } from './tables/disconnection';
import { TWIN_AND_EARTH_4D5 } from './tables/twin-and-earth-4d5';
import type { Check, CircuitResult, Verdict } from './types';
import { nominalVoltage, voltageDrop, voltageDropLimitPct } from './voltage-drop';

/** Share of a limit at which a passing check counts as near its limit. */
export const NEAR_LIMIT_SHARE = 0.9;

/** Maximum touch voltage on a TT system, V (BS 7671 411.5.3: RA·IΔn ≤ 50 V). */
const TT_TOUCH_VOLTAGE_V = 50;

/** Format a number for a message (display only; results are never rounded). */
function fmt(x: number, d = 2): string {
  return Number.isFinite(x) ? x.toFixed(d) : String(x);
}

/** Everything about a circuit that evaluating one cable size needs. */
interface EvalContext {
  c: CircuitInput['circuit'];
  supply: CircuitInput['supply'];
  maxTempC: 70 | 90;
  ring: boolean;
  ibA: number;
  vNominal: number;
  vdLimitPct: number;
  zsMaxOhm: number | null;
  originFaultA: number | null;
  deviceFacts: DeviceFacts | null;
  rcdMa: number | null;
}

/** Evaluate one size: voltage drop, R1+R2, Zs, fault energy and the adiabatic minimum cpc. */
function evaluateSize(ctx: EvalContext, csaMm2: number, row: CableRowData | null): SizeEvaluation {
  const { c, supply, maxTempC, ring, ibA, zsMaxOhm } = ctx;
  const uoV = supply.uoV;
  const cpcMm2 =
    c.cpcMm2 ??
    row?.constructionCpcMm2 ??
    (c.cable === 'te-70' ? (teConstructionCpc(csaMm2) ?? csaMm2) : csaMm2);
  const vdV = row ? voltageDrop(row.mvAm, ibA, c.lengthM, ring) : null;
  const vdPct = vdV === null ? null : (vdV / ctx.vNominal) * 100;
  const loop = loopImpedance({ csaMm2, cpcMm2, maxTempC, lengthM: c.lengthM, ring, zeOhm: supply.zeOhm });
  const farEndFaultA = loop && loop.zsOhm > 0 ? uoV / loop.zsOhm : null;
  const fe = ctx.deviceFacts
    ? faultEnergy({ device: ctx.deviceFacts, farEndFaultA, originFaultA: ctx.originFaultA, rcdMa: ctx.rcdMa })
    : null;
  const cpcMinMm2 = fe ? minimumCpc(fe.energy.i2t, kFactor(c.cable, cpcMm2)) : null;
  return {
    row,
    csaMm2,
    cpcMm2,
    vdV,
    vdPct,
    r1r2Ohm: loop?.r1r2Ohm ?? null,
    zsOhm: loop?.zsOhm ?? null,
    farEndFaultA,
    cpcMinMm2,
    adiabaticTimeS: fe?.energy.timeS ?? null,
    energyBasis: fe?.energy.basis ?? null,
    energyFaultA: fe?.faultA ?? null,
    vdOk: vdPct !== null && vdPct <= ctx.vdLimitPct,
    faultOk:
      zsMaxOhm !== null &&
      loop !== null &&
      loop.zsOhm <= zsMaxOhm &&
      cpcMinMm2 !== null &&
      cpcMm2 >= cpcMinMm2,
  };
}

/** Evaluates table rows on demand, each at most once. */
class RowEvaluator implements SizeEvaluator {
  private readonly cache: (SizeEvaluation | undefined)[];
  constructor(
    private readonly ctx: EvalContext,
    private readonly rows: readonly CableRowData[],
  ) {
    this.cache = new Array(rows.length);
  }
  at(i: number): SizeEvaluation {
    return (this.cache[i] ??= evaluateSize(this.ctx, this.rows[i].csaMm2, this.rows[i]));
  }
}

function teConstructionCpc(csaMm2: number): number | null {
  const i = (TWIN_AND_EARTH_4D5.sizesMm2 as readonly number[]).indexOf(csaMm2);
  return i < 0 ? null : TWIN_AND_EARTH_4D5.cpcMm2[i];
}

/**
 * Size one circuit by the BS 7671 method of design/sizing.md. `input` must already have been
 * validated with `circuitInputSchema` (the routes parse; the engine does not re-parse, for
 * speed). Never throws for validated input: a combination the tables do not cover is a
 * failed check, and a number that cannot be computed is null.
 *
 * Verdict: `fails` if any check fails; `near-limit` if all pass and at least one margin is at
 * or above 90 % of its limit — voltage drop ≥ 90 % of the limit, Zs ≥ 90 % of max Zs,
 * Ib ≥ 90 % of Iz (0.67·Ib for a ring; the cable runs close to its capacity), or the adiabatic minimum cpc ≥ 90 %
 * of the cpc fitted; otherwise `passes`.
 */
export function sizeCircuit(input: CircuitInput): CircuitResult {
  const { supply, circuit: c } = input;
  const checks: Check[] = [];
  const notes: string[] = [];
  const props = CABLE_PROPERTIES[c.cable];
  const maxTempC = props.maxTempC;
  const dev = c.device;
  const uoV = supply.uoV;
  const tt = supply.earthing === 'TT';
  const ring = c.load.kind === 'socket-arrangement' && SOCKET_ARRANGEMENTS[c.load.arrangement].ring;
  const buried = c.buried ?? c.method === 'D';
  const rcdMa = dev.rcdMa ?? null;

  // Step 1: design current Ib.
  const ibA = designCurrent(c.load, c.phases, uoV, dev.kind);

  // Step 2: device rating In, chosen or given.
  const inA = dev.ratingA ?? chooseRating(ibA, dev.kind);

  // Step 3: correction factors and the tabulated current the cable needs.
  const factors = correctionFactors({
    ambientC: c.ambientC,
    maxTempC,
    circuits: c.grouping.circuits,
    arrangement: c.grouping.arrangement,
    insulationMm: c.insulationMm,
    method: c.method,
    deviceKind: dev.kind,
    buried,
  });
  const requiredItA = inA === null ? null : requiredTabulatedCurrent(inA, factors, ring);
  if (c.insulationMm > 0 && factors.ci === 1) {
    notes.push(`Method ${c.method} ratings already allow for thermal insulation: Ci not applied.`);
  }

  // Step 4: the table column for this cable, method and number of phases.
  const rows = cableRows(c.cable, c.method, c.phases);
  const methodOk = methodsFor(c.cable).includes(c.method);
  if (!methodOk) {
    checks.push({
      code: 'method',
      ok: false,
      message: `Method ${c.method} is not tabulated for ${props.label} cable; use one of ${methodsFor(c.cable).join(', ')}.`,
      reference: props.table,
    });
  } else if (!rows) {
    checks.push({
      code: 'method',
      ok: false,
      message: `${props.label} cable has no three-phase rating; use multicore or single-core cable.`,
      reference: props.table,
    });
  }
  if (buried && c.cable !== 'swa-xlpe-90') {
    checks.push({
      code: 'buried',
      ok: false,
      message: 'Only armoured cable (method D) is tabulated for burying in the ground.',
      reference: 'BS 7671:2018 Table 4E4A, 522.8.10',
    });
  }
  if (factors.ca === null) {
    checks.push({
      code: 'ambient',
      ok: false,
      message: `An ambient of ${c.ambientC} °C is above the last row of Table ${c.method === 'D' ? '4B2 (ground)' : '4B1'} for ${maxTempC} °C cable.`,
      reference: c.method === 'D' ? 'BS 7671:2018 Table 4B2' : 'BS 7671:2018 Table 4B1',
    });
  }

  // Step 5: socket arrangement limits (common practice, UK on-site guidance).
  if (c.load.kind === 'socket-arrangement') {
    const arr = SOCKET_ARRANGEMENTS[c.load.arrangement];
    const areaOk = c.load.floorAreaM2 <= arr.maxFloorAreaM2;
    checks.push({
      code: 'floor-area',
      ok: areaOk,
      message: `Floor area served ${fmt(c.load.floorAreaM2, 1)} m² ${areaOk ? '≤' : '>'} ${arr.maxFloorAreaM2} m² for a ${c.load.arrangement} arrangement.`,
      reference: 'Common practice: UK on-site guidance, socket-outlet final circuits',
    });
    if (inA !== null) {
      const ratingOk = inA <= arr.nominalA;
      checks.push({
        code: 'arrangement-rating',
        ok: ratingOk,
        message: `Device ${inA} A ${ratingOk ? 'within' : 'above'} the ${arr.nominalA} A of a ${c.load.arrangement} arrangement.`,
        reference: 'Common practice: UK on-site guidance, socket-outlet final circuits',
      });
    }
  }

  // Step 6: Ib ≤ In.
  checks.push(
    inA === null
      ? {
          code: 'design-current',
          ok: false,
          message: `No standard ${dev.kind} rating carries Ib = ${fmt(ibA)} A.`,
          reference: 'BS 7671:2018 433.1.1',
        }
      : {
          code: 'design-current',
          ok: ibA <= inA,
          message: `Ib ${fmt(ibA)} A ${ibA <= inA ? '≤' : '>'} In ${inA} A.`,
          reference: 'BS 7671:2018 433.1.1',
        },
  );

  // Step 7: disconnection time, max Zs and the limits that do not depend on cable size.
  const disconnectionTimeS = requiredDisconnectionTime(c.use, inA ?? ibA, supply.earthing, uoV);
  const deviceFacts: DeviceFacts | null =
    inA === null ? null : { kind: dev.kind, curve: dev.curve ?? null, inA };
  const zsMaxOhm = !deviceFacts
    ? null
    : tt
      ? rcdMa === null
        ? null
        : TT_TOUCH_VOLTAGE_V / (rcdMa / 1000)
      : maxZs(deviceFacts, disconnectionTimeS, uoV);
  const vdLimitPct = voltageDropLimitPct(c.use, supply.source);
  const vNominal = nominalVoltage(c.phases, uoV);
  const originFaultA =
    supply.zeOhm > 0
      ? supply.pfcKa > 0
        ? Math.min(uoV / supply.zeOhm, supply.pfcKa * 1000)
        : uoV / supply.zeOhm
      : supply.pfcKa > 0
        ? supply.pfcKa * 1000
        : null;

  const ctx: EvalContext = {
    c,
    supply,
    maxTempC,
    ring,
    ibA,
    vNominal,
    vdLimitPct,
    zsMaxOhm,
    originFaultA,
    deviceFacts,
    rcdMa,
  };

  // Step 8: choose the cable size, or check the fixed one (never changed).
  let chosen: SizeEvaluation | null = null;
  let capacityMessage: string | null = null;
  if (c.csaMm2 !== null) {
    let row: CableRowData | null = null;
    if (rows) for (const r of rows) if (r.csaMm2 === c.csaMm2) row = r;
    if (rows && !row) {
      capacityMessage = `${c.csaMm2} mm² is not in ${props.table} for method ${c.method}.`;
    }
    chosen = evaluateSize(ctx, c.csaMm2, row);
  } else if (rows && requiredItA !== null) {
    const hopeless = zsMaxOhm === null || supply.zeOhm >= zsMaxOhm;
    const evaluator = new RowEvaluator(ctx, rows);
    const idx = chooseCableSize(rows, requiredItA, evaluator, hopeless);
    if (idx < 0) {
      const top = rows[rows.length - 1];
      capacityMessage = `No size in ${props.table} (method ${c.method}) has It ≥ ${fmt(requiredItA)} A; the largest, ${top.csaMm2} mm², has ${top.itA} A.`;
    } else {
      chosen = evaluator.at(idx);
    }
  }
  const row = chosen?.row ?? null;
  const derating =
    factors.ca === null ? null : factors.ca * factors.cg * factors.ci * factors.cc;
  const itA = row ? row.itA : null;
  const izA = itA !== null && derating !== null ? itA * derating : null;

  // Step 9: In ≤ Iz (a ring: 0.67·In ≤ Iz).
  const needA = inA === null ? null : ring ? 0.67 * inA : inA;
  if (capacityMessage || izA === null || needA === null) {
    checks.push({
      code: 'cable-capacity',
      ok: false,
      message:
        capacityMessage ??
        'The cable rating cannot be found for this combination (see the other checks).',
      reference: `${props.table}; BS 7671:2018 433.1.1`,
    });
  } else {
    const ok = needA <= izA;
    checks.push({
      code: 'cable-capacity',
      ok,
      message: `${ring ? '0.67·In' : 'In'} ${fmt(needA)} A ${ok ? '≤' : '>'} Iz ${fmt(izA)} A (It ${itA} A × ${fmt(derating ?? 0, 3)}).`,
      reference: ring ? 'BS 7671:2018 433.1.204' : 'BS 7671:2018 433.1.1',
    });
  }

  // Step 10: voltage drop.
  if (chosen && chosen.vdPct !== null && chosen.vdV !== null) {
    checks.push({
      code: 'voltage-drop',
      ok: chosen.vdOk,
      message: `Voltage drop ${fmt(chosen.vdV)} V = ${fmt(chosen.vdPct)} % ${chosen.vdOk ? '≤' : '>'} ${vdLimitPct} %${ring ? ' (ring, ÷4)' : ''}.`,
      reference: 'BS 7671:2018 Appendix 4 Table 4Ab, 525',
    });
  } else {
    checks.push({
      code: 'voltage-drop',
      ok: false,
      message: 'Voltage drop cannot be computed without a tabulated cable size.',
      reference: 'BS 7671:2018 Appendix 4 Table 4Ab, 525',
    });
  }

  // Step 11: earth fault loop impedance and disconnection (TT: RA·IΔn ≤ 50 V).
  const zsOhm = chosen?.zsOhm ?? null;
  if (tt) {
    checks.push({
      code: 'tt-rcd',
      ok: rcdMa !== null,
      message:
        rcdMa !== null
          ? `RCD ${rcdMa} mA provides fault protection on the TT system.`
          : 'A TT system needs an RCD for fault protection; none is given.',
      reference: 'BS 7671:2018 411.5.2',
    });
    if (supply.zeOhm > 200) {
      notes.push('Earth electrode resistance above 200 Ω may not be stable (BS 7671 Table 41.5 note).');
    }
  }
  if (zsOhm === null || zsMaxOhm === null) {
    checks.push({
      code: 'disconnection',
      ok: false,
      message:
        zsMaxOhm === null
          ? tt
            ? 'No RCD, so no maximum earth fault loop impedance on TT.'
            : `No tabulated max Zs for ${dev.kind}${dev.curve ?? ''} ${inA ?? '?'} A at ${disconnectionTimeS} s.`
          : 'Zs cannot be computed for this cable size.',
      reference: tt ? 'BS 7671:2018 411.5.3' : 'BS 7671:2018 411.4.4, Tables 41.2–41.4',
    });
  } else {
    const ok = zsOhm <= zsMaxOhm;
    checks.push({
      code: 'disconnection',
      ok,
      message: tt
        ? `RA·IΔn = ${fmt(zsOhm)} Ω × ${rcdMa} mA = ${fmt((zsOhm * (rcdMa ?? 0)) / 1000)} V ${ok ? '≤' : '>'} 50 V (RA taken as Zs = Ze + R1+R2; common practice takes RA ≈ Ze).`
        : `Zs ${fmt(zsOhm, 3)} Ω ${ok ? '≤' : '>'} max ${fmt(zsMaxOhm, 3)} Ω for ${disconnectionTimeS} s.`,
      reference: tt
        ? 'BS 7671:2018 411.5.3'
        : dev.kind === 'mcb' || dev.kind === 'rcbo'
          ? 'BS 7671:2018 411.4.4, Table 41.3 (0.95·Uo/Ia)'
          : 'BS 7671:2018 411.4.4, Tables 41.2/41.4 (from memory)',
    });
  }

  // Step 12: prospective fault current against breaking capacity.
  const breakingKa = dev.breakingKa ?? DEFAULT_BREAKING_KA[dev.kind];
  if (dev.breakingKa === undefined) {
    notes.push(`Breaking capacity not given: ${breakingKa} kA assumed (typical, from memory).`);
  }
  const pfcOk = supply.pfcKa <= breakingKa;
  checks.push({
    code: 'breaking-capacity',
    ok: pfcOk,
    message: `PFC ${fmt(supply.pfcKa)} kA ${pfcOk ? '≤' : '>'} breaking capacity ${breakingKa} kA.`,
    reference: 'BS 7671:2018 434.5.1',
  });

  // Step 13: adiabatic check of the cpc.
  const cpcMinMm2 = chosen?.cpcMinMm2 ?? null;
  if (chosen && cpcMinMm2 !== null) {
    const ok = chosen.cpcMm2 >= cpcMinMm2;
    checks.push({
      code: 'adiabatic',
      ok,
      message: `cpc ${chosen.cpcMm2} mm² ${ok ? '≥' : '<'} ${fmt(cpcMinMm2, 3)} mm² (√(I²t)/k at ${fmt(chosen.energyFaultA ?? 0, 0)} A; ${chosen.energyBasis}).`,
      reference: 'BS 7671:2018 543.1.3, Table 54.3',
    });
  } else {
    checks.push({
      code: 'adiabatic',
      ok: false,
      message: 'The fault energy cannot be found: the device does not operate in a known time at this fault current.',
      reference: 'BS 7671:2018 543.1.3',
    });
  }

  // Step 14: RCD for additional protection.
  const dwelling = c.dwelling ?? (c.use === 'lighting' || c.use === 'sockets');
  const reasons = additionalRcdReasons({
    use: c.use,
    inA: inA ?? ibA,
    concealedInWall: c.concealedInWall,
    dwelling,
  });
  if (reasons.length > 0) {
    const ok = rcdMa !== null && rcdMa <= 30;
    checks.push({
      code: 'rcd-additional',
      ok,
      message: `${ok ? `RCD ${rcdMa} mA present` : 'A 30 mA RCD is required'} for ${reasons.join('; ')}.`,
      reference: 'BS 7671:2018 411.3.3, 411.3.4, 522.6.202',
    });
  }

  // Verdict, with near-limit margins.
  let allOk = true;
  for (const k of checks) if (!k.ok) allOk = false;
  let verdict: Verdict = allOk ? 'passes' : 'fails';
  if (allOk && chosen) {
    const near: string[] = [];
    if (chosen.vdPct !== null && chosen.vdPct >= NEAR_LIMIT_SHARE * vdLimitPct) near.push('voltage drop');
    if (zsOhm !== null && zsMaxOhm !== null && zsOhm >= NEAR_LIMIT_SHARE * zsMaxOhm) near.push('Zs');
    // A ring's cable carries about half the load each way: compare 0.67·Ib, as for In.
    if (izA !== null && (ring ? 0.67 : 1) * ibA >= NEAR_LIMIT_SHARE * izA) near.push('Ib against Iz');
    if (cpcMinMm2 !== null && cpcMinMm2 >= NEAR_LIMIT_SHARE * chosen.cpcMm2) near.push('adiabatic cpc');
    if (near.length > 0) {
      verdict = 'near-limit';
      notes.push(`Within 10 % of its limit: ${near.join(', ')}.`);
    }
  }

  return {
    ibA,
    inA,
    factors,
    requiredItA,
    csaMm2: chosen?.csaMm2 ?? null,
    cpcMm2: chosen?.cpcMm2 ?? null,
    itA,
    izA,
    vdV: chosen?.vdV ?? null,
    vdPct: chosen?.vdPct ?? null,
    vdLimitPct,
    r1r2Ohm: chosen?.r1r2Ohm ?? null,
    zsOhm,
    zsMaxOhm,
    faultCurrentA: chosen?.farEndFaultA ?? null,
    cpcMinMm2,
    disconnectionTimeS,
    adiabaticTimeS: chosen?.adiabaticTimeS ?? null,
    tableRow: row
      ? { table: props.table, method: c.method, csaMm2: row.csaMm2, itA: row.itA, mvAm: row.mvAm }
      : null,
    checks,
    verdict,
    notes,
  };
}
