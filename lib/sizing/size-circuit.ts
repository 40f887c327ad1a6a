import { chooseCableSize, type SizeEvaluation, type SizeEvaluator } from './cable-selection';
import { chooseRating, designCurrent } from './design-current';
import {
  correctionFactors,
  effectiveTabulated,
  isInsulationMethod,
  requiredCapacity,
  requiredTabulatedCurrent,
  RING_MIN_CSA_MM2,
} from './factors';
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
import { ARRANGEMENT_NAMES, CABLE_SHORT_NAMES, deviceKindName, deviceName } from '../names';
import { type CircuitInput } from './schemas';
import { ARMOUR_TEMPERATURE_FACTOR, ARMOURED_4E4, SWA_ARMOUR } from './tables/armoured-4e4';
import { DEFAULT_BREAKING_KA } from './tables/breaking-capacity';
import { CABLE_PROPERTIES, type CableRowData, cableRows, methodsFor } from './tables/cables';
import { SOCKET_ARRANGEMENTS } from './tables/disconnection';
import { TWIN_AND_EARTH_4D5 } from './tables/twin-and-earth-4d5';
import type { Check, CircuitResult, Verdict } from './types';
import { validCircuitInput } from './validate';
import { nominalVoltage, voltageDrop, voltageDropLimitPct } from './voltage-drop';

/** How every check cites the wiring regulations: one edition, written one way. */
export const BS7671 = 'BS 7671:2018+A2:2022';

/** Share of a limit at which a passing check counts as near its limit. */
export const NEAR_LIMIT_SHARE = 0.9;

/** Maximum touch voltage on a TT system, V (BS 7671 411.5.3: RA·IΔn ≤ 50 V). */
const TT_TOUCH_VOLTAGE_V = 50;

const POW10 = [1, 10, 100, 1000, 10000];

/**
 * Format a number with `d` decimals for a message (display only; results are never rounded).
 * As toFixed, by integer arithmetic: toFixed was a fifth of the engine's time.
 */
function fmt(x: number, d = 2): string {
  if (!Number.isFinite(x) || Math.abs(x) >= 1e12) return Number.isFinite(x) ? x.toFixed(d) : String(x);
  const p = POW10[d];
  const n = Math.round(Math.abs(x) * p);
  const whole = Math.floor(n / p);
  const sign = x < 0 && n > 0 ? '-' : '';
  if (d === 0) return sign + whole;
  let frac = String(n - whole * p);
  while (frac.length < d) frac = '0' + frac;
  return sign + whole + '.' + frac;
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
  deviceFacts: DeviceFacts | null;
  rcdMa: number | null;
  disconnectionTimeS: number;
  /** The armoured cable's cpc, or null for other cables. */
  armouredCpc: 'spare-core' | 'armour' | null;
}

/** Armour area, mm², and resistance at its operating temperature, Ω/m, of an armoured size. */
function armourOf(csaMm2: number, phases: 1 | 3): { areaMm2: number; rPerM: number } | null {
  const i = (ARMOURED_4E4.sizesMm2 as readonly number[]).indexOf(csaMm2);
  if (i < 0) return null;
  // Armour as the cpc: a two-core cable single-phase, a four-core cable three-phase.
  const a = SWA_ARMOUR[phases === 3 ? 4 : 2];
  return { areaMm2: a.areaMm2[i], rPerM: (a.r20MohmPerM[i] * ARMOUR_TEMPERATURE_FACTOR) / 1000 };
}

/** Evaluate one size: voltage drop, R1+R2, Zs, fault energy and the adiabatic minimum cpc. */
function evaluateSize(ctx: EvalContext, csaMm2: number, row: CableRowData | null): SizeEvaluation {
  const { c, supply, maxTempC, ring, ibA, zsMaxOhm } = ctx;
  const uoV = supply.uoV;
  const armour = ctx.armouredCpc === 'armour' ? armourOf(csaMm2, c.phases) : null;
  const cpcMm2 = armour
    ? armour.areaMm2
    : (c.cpcMm2 ?? row?.constructionCpcMm2 ?? (c.cable === 'te-70' ? (teConstructionCpc(csaMm2) ?? csaMm2) : csaMm2));
  const vdV = row ? voltageDrop(row.mvAm, ibA, c.lengthM, ring) : null;
  const vdPct = vdV === null ? null : (vdV / ctx.vNominal) * 100;
  const loop =
    ctx.armouredCpc === 'armour' && !armour
      ? null
      : loopImpedance({
          csaMm2,
          cpcMm2,
          maxTempC,
          lengthM: c.lengthM,
          ring,
          zeOhm: supply.zeOhm,
          r2PerM: armour?.rPerM,
        });
  // The far-end earth fault current Uo/Zs, never above the prospective fault current at
  // the board where one is given (it cannot exceed the current at the origin).
  const uoOverZs = loop && loop.zsOhm > 0 ? uoV / loop.zsOhm : null;
  const farEndFaultA = uoOverZs !== null && supply.pfcKa > 0 ? Math.min(uoOverZs, supply.pfcKa * 1000) : uoOverZs;
  const fe = ctx.deviceFacts
    ? faultEnergy({ device: ctx.deviceFacts, farEndFaultA, rcdMa: ctx.rcdMa, timeS: ctx.disconnectionTimeS })
    : null;
  const cpcMinMm2 = fe ? minimumCpc(fe.energy.i2t, kFactor(c.cable, cpcMm2, armour !== null)) : null;
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
    faultOk: zsMaxOhm !== null && loop !== null && loop.zsOhm <= zsMaxOhm && cpcMinMm2 !== null && cpcMm2 >= cpcMinMm2,
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

/** Rows with each size's rating min(It, It of method C × Ci), built once per column and Ci. */
const INSULATED_ROWS = new Map<string, readonly CableRowData[]>();

function insulatedRows(
  cable: CircuitInput['circuit']['cable'],
  method: string,
  phases: 1 | 3,
  tableRows: readonly CableRowData[],
  ci: number,
): readonly CableRowData[] {
  const key = `${cable}|${method}|${phases}|${ci}`;
  let rows = INSULATED_ROWS.get(key);
  if (!rows) {
    const methodC = cableRows(cable, 'C', phases);
    rows = tableRows.map((r, i) => {
      const itC = methodC && methodC[i]?.csaMm2 === r.csaMm2 ? methodC[i].itA : null;
      return { ...r, itA: effectiveTabulated(r.itA, itC, ci) };
    });
    INSULATED_ROWS.set(key, rows);
  }
  return rows;
}

function teConstructionCpc(csaMm2: number): number | null {
  const i = (TWIN_AND_EARTH_4D5.sizesMm2 as readonly number[]).indexOf(csaMm2);
  return i < 0 ? null : TWIN_AND_EARTH_4D5.cpcMm2[i];
}

/**
 * Size one circuit by the BS 7671 design method: Ib, then In, the correction factors, It and Iz,
 * the cable size, voltage drop, R1+R2 and Zs, disconnection, fault current and the cpc's
 * adiabatic check, and additional (RCD) protection. The input is validated here
 * (see `validCircuitInput`: an input that came from `parseCircuitInput` is not parsed
 * again); an input the schema refuses throws a SizingInputError naming each bad field.
 * Never throws for a valid input: a combination the tables do not cover is a failed check,
 * and a number that cannot be computed is null.
 *
 * Verdict: `fails` if any check fails; `near-limit` if all pass and at least one margin is at
 * or above 90 % of its limit — voltage drop ≥ 90 % of the limit, Zs ≥ 90 % of max Zs,
 * Ib ≥ 90 % of Iz (Ib × 20/In for a ring on 30/32 A; the cable runs close to its capacity), or the adiabatic minimum cpc ≥ 90 %
 * of the cpc fitted; otherwise `passes`.
 */
export function sizeCircuit(input: CircuitInput): CircuitResult {
  return sizeValidCircuit(validCircuitInput(input));
}

/** Size a circuit already validated (sizeBoard's ways, after the board was validated). */
export function sizeValidCircuit(input: CircuitInput): CircuitResult {
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
    inDucts: c.inDucts,
    spacingM: c.grouping.spacingM,
  });
  const requiredItA = inA === null ? null : requiredTabulatedCurrent(inA, factors, ring);
  const insulated = c.insulationMm > 0 && !isInsulationMethod(c.method);
  if (c.insulationMm > 0 && !insulated) {
    notes.push(`Method ${c.method} ratings already allow for thermal insulation: Ci not applied.`);
  }

  // Step 4: the table column for this cable, method and number of phases; where part of
  // the run is surrounded by insulation, each size's rating is min(It, It of method C × Ci).
  const tableRows = cableRows(c.cable, c.method, c.phases);
  let rows = tableRows;
  if (tableRows && insulated) rows = insulatedRows(c.cable, c.method, c.phases, tableRows, factors.ci);
  const methodOk = methodsFor(c.cable).includes(c.method);
  const cableName = CABLE_SHORT_NAMES[c.cable];
  if (!methodOk) {
    checks.push({
      code: 'method',
      ok: false,
      message: `Reference method ${c.method} is not tabulated for ${cableName} cable; use one of ${methodsFor(c.cable).join(', ')}.`,
      reference: props.table,
    });
  } else if (!rows) {
    checks.push({
      code: 'method',
      ok: false,
      message: `Flat twin and earth cable has no three-phase rating; use multicore or single-core cable.`,
      reference: props.table,
    });
  }
  if (buried && c.cable !== 'swa-xlpe-90') {
    checks.push({
      code: 'buried',
      ok: false,
      message: 'Only armoured cable (reference method D) is tabulated for burying in the ground.',
      reference: 'BS 7671:2018+A2:2022 Table 4E4A, 522.8.10',
    });
  }
  if (factors.ca === null) {
    checks.push({
      code: 'ambient',
      ok: false,
      message: `An ambient of ${c.ambientC} °C is above the last row of Table ${c.method === 'D' ? '4B2 (ground)' : '4B1'} for ${maxTempC} °C cable.`,
      reference: c.method === 'D' ? 'BS 7671:2018+A2:2022 Table 4B2' : 'BS 7671:2018+A2:2022 Table 4B1',
    });
  }
  if (factors.cg === null) {
    checks.push({
      code: 'grouping',
      ok: false,
      message: `Tables 4C2 and 4C3 give grouping factors for up to 6 circuits in the ground; ${c.grouping.circuits} need the cable maker's data or a rating study.`,
      reference: 'BS 7671:2018+A2:2022 Tables 4C2, 4C3',
    });
  }
  const ringTooSmall = ring && c.csaMm2 !== null && c.csaMm2 < RING_MIN_CSA_MM2;
  if (ringTooSmall) {
    checks.push({
      code: 'ring-size',
      ok: false,
      message: `A ring final circuit needs conductors of at least ${RING_MIN_CSA_MM2} mm²; ${c.csaMm2} mm² is fixed.`,
      reference: 'BS 7671:2018+A2:2022 433.1.204',
    });
  }

  // Step 5: socket arrangement limits (common practice, UK on-site guidance).
  if (c.load.kind === 'socket-arrangement') {
    const arr = SOCKET_ARRANGEMENTS[c.load.arrangement];
    const areaOk = c.load.floorAreaM2 <= arr.maxFloorAreaM2;
    const arrName = ARRANGEMENT_NAMES[c.load.arrangement];
    checks.push({
      code: 'floor-area',
      ok: areaOk,
      message: `Floor area served ${fmt(c.load.floorAreaM2, 1)} m² ${areaOk ? '≤' : '>'} ${arr.maxFloorAreaM2} m² for a ${arrName}.`,
      reference: 'Common practice: UK on-site guidance, socket-outlet final circuits',
    });
    if (inA !== null) {
      const ratingOk = inA <= arr.nominalA;
      checks.push({
        code: 'arrangement-rating',
        ok: ratingOk,
        message: `Device ${inA} A ${ratingOk ? 'within' : 'above'} the ${arr.nominalA} A of a ${arrName}.`,
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
          message: `No standard rating of ${deviceKindName(dev.kind)} carries Ib = ${fmt(ibA)} A.`,
          reference: 'BS 7671:2018+A2:2022 433.1.1',
        }
      : {
          code: 'design-current',
          ok: ibA <= inA,
          message: `Ib ${fmt(ibA)} A ${ibA <= inA ? '≤' : '>'} In ${inA} A.`,
          reference: 'BS 7671:2018+A2:2022 433.1.1',
        },
  );

  // Step 7: disconnection time, max Zs and the limits that do not depend on cable size.
  const disconnectionTimeS = requiredDisconnectionTime(c.use, inA ?? ibA, supply.earthing, uoV);
  const deviceFacts: DeviceFacts | null = inA === null ? null : { kind: dev.kind, curve: dev.curve ?? null, inA };
  const zsMaxOhm = !deviceFacts
    ? null
    : tt
      ? rcdMa === null
        ? null
        : TT_TOUCH_VOLTAGE_V / (rcdMa / 1000)
      : maxZs(deviceFacts, disconnectionTimeS, uoV);
  // The limit runs from the origin: a board fed by sub-mains has what they left of it.
  const originVdLimitPct = voltageDropLimitPct(c.use, supply.source);
  const vdUsedAbovePct = supply.vdUsedPct ?? 0;
  const vdLimitPct = originVdLimitPct - vdUsedAbovePct;
  const vNominal = nominalVoltage(c.phases, uoV);
  // Armoured cable: a spare core where the cable has one (3-core single-phase), else the
  // armour (4-core three-phase); the designer can choose either.
  const armouredCpc = c.cable === 'swa-xlpe-90' ? (c.armouredCpc ?? (c.phases === 3 ? 'armour' : 'spare-core')) : null;

  const ctx: EvalContext = {
    c,
    supply,
    maxTempC,
    ring,
    ibA,
    vNominal,
    vdLimitPct,
    zsMaxOhm,
    deviceFacts,
    rcdMa,
    disconnectionTimeS,
    armouredCpc,
  };

  // Step 8: choose the cable size, or check the fixed one (never changed).
  let chosen: SizeEvaluation | null = null;
  let capacityMessage: string | null = null;
  if (c.csaMm2 !== null) {
    let row: CableRowData | null = null;
    if (rows) for (const r of rows) if (r.csaMm2 === c.csaMm2) row = r;
    if (rows && !row) {
      capacityMessage = `${c.csaMm2} mm² is not in ${props.table} for reference method ${c.method}.`;
    }
    chosen = evaluateSize(ctx, c.csaMm2, row);
  } else if (rows && requiredItA !== null) {
    const hopeless = zsMaxOhm === null || supply.zeOhm >= zsMaxOhm;
    const evaluator = new RowEvaluator(ctx, rows);
    const idx = chooseCableSize(rows, requiredItA, evaluator, hopeless, ring ? RING_MIN_CSA_MM2 : 0);
    if (idx < 0) {
      const top = rows[rows.length - 1];
      capacityMessage = `No size in ${props.table} (reference method ${c.method}) has It ≥ ${fmt(requiredItA)} A; the largest, ${top.csaMm2} mm², has ${fmt(top.itA, 1)} A.`;
    } else {
      chosen = evaluator.at(idx);
    }
  }
  const row = chosen?.row ?? null;
  // Ci is already inside each row's It (the method C rating × Ci where that is lower).
  const derating = factors.ca === null || factors.cg === null ? null : factors.ca * factors.cg * factors.cc;
  const itA = row ? row.itA : null;
  const izA = itA !== null && derating !== null ? itA * derating : null;

  // Step 9: In ≤ Iz (a ring on a 30/32 A device: Iz ≥ 20 A, 433.1.204).
  const needA = inA === null ? null : requiredCapacity(inA, ring);
  const ringRule = ring && needA !== inA;
  if (capacityMessage || izA === null || needA === null) {
    checks.push({
      code: 'cable-capacity',
      ok: false,
      message: capacityMessage ?? 'The cable rating cannot be found for this combination (see the other checks).',
      reference: `${props.table}; ${BS7671} 433.1.1`,
    });
  } else {
    const ok = needA <= izA;
    const itWords = insulated
      ? `It ${fmt(itA ?? 0, 1)} A, the lower of method ${c.method} and method C × Ci ${fmt(factors.ci, 2)}`
      : `It ${fmt(itA ?? 0, 1)} A`;
    checks.push({
      code: 'cable-capacity',
      ok,
      message: ringRule
        ? `Ring on ${inA} A: Iz ${fmt(izA)} A ${ok ? '≥' : '<'} ${needA} A (${itWords} × ${fmt(derating ?? 0, 3)}).`
        : `In ${fmt(needA)} A ${ok ? '≤' : '>'} Iz ${fmt(izA)} A (${itWords} × ${fmt(derating ?? 0, 3)}).`,
      reference: ringRule ? 'BS 7671:2018+A2:2022 433.1.204' : 'BS 7671:2018+A2:2022 433.1.1',
    });
  }

  // Step 10: voltage drop.
  if (chosen && chosen.vdPct !== null && chosen.vdV !== null) {
    checks.push({
      code: 'voltage-drop',
      ok: chosen.vdOk,
      message: `Voltage drop ${fmt(chosen.vdV)} V = ${fmt(chosen.vdPct)} % ${chosen.vdOk ? '≤' : '>'} ${vdUsedAbovePct > 0 ? `${fmt(vdLimitPct)} % (${originVdLimitPct} % from the origin less ${fmt(vdUsedAbovePct)} % used by the sub-mains above)` : `${vdLimitPct} %`}${ring ? ' (ring, ÷4)' : ''}.`,
      reference: 'BS 7671:2018+A2:2022 Appendix 4 Table 4Ab, 525',
    });
  } else {
    checks.push({
      code: 'voltage-drop',
      ok: false,
      message: 'Voltage drop cannot be computed without a tabulated cable size.',
      reference: 'BS 7671:2018+A2:2022 Appendix 4 Table 4Ab, 525',
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
      reference: 'BS 7671:2018+A2:2022 411.5.2',
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
            : `No tabulated maximum Zs for a ${deviceName(dev, inA)} at ${disconnectionTimeS} s.`
          : 'Zs cannot be computed for this cable size.',
      reference: tt ? 'BS 7671:2018+A2:2022 411.5.3' : 'BS 7671:2018+A2:2022 411.4.4, Tables 41.2–41.4',
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
        ? 'BS 7671:2018+A2:2022 411.5.3'
        : dev.kind === 'mcb' || dev.kind === 'rcbo'
          ? 'BS 7671:2018+A2:2022 411.4.4, Table 41.3 (0.95·Uo/Ia)'
          : 'BS 7671:2018+A2:2022 411.4.4, Tables 41.2/41.4 (from memory)',
    });
  }

  // Step 12: prospective fault current against breaking capacity.
  const breakingKa = dev.breakingKa ?? DEFAULT_BREAKING_KA[dev.kind];
  if (dev.breakingKa === undefined) {
    notes.push(`Breaking capacity not given: ${breakingKa} kA assumed (typical, from memory).`);
  }
  const deviceOk = supply.pfcKa <= breakingKa;
  const assemblyKa = dev.conditionalRatingKa ?? null;
  const assemblyOk = !deviceOk && assemblyKa !== null && supply.pfcKa <= assemblyKa;
  checks.push({
    code: 'breaking-capacity',
    ok: deviceOk || assemblyOk,
    message: deviceOk
      ? `PFC ${fmt(supply.pfcKa)} kA ≤ breaking capacity ${breakingKa} kA.`
      : assemblyKa === null
        ? `PFC ${fmt(supply.pfcKa)} kA > breaking capacity ${breakingKa} kA.`
        : `PFC ${fmt(supply.pfcKa)} kA > the device's ${breakingKa} kA, ${assemblyOk ? 'but ≤' : 'and >'} the ${assemblyKa} kA rated conditional short-circuit current the board declares for its assembly (BS EN 61439-3).`,
    reference:
      assemblyKa === null ? 'BS 7671:2018+A2:2022 434.5.1' : 'BS 7671:2018+A2:2022 434.5.1, 536.4.201 (from memory)',
  });

  // Step 13: adiabatic check of the cpc.
  const cpcMinMm2 = chosen?.cpcMinMm2 ?? null;
  if (chosen && cpcMinMm2 !== null) {
    const ok = chosen.cpcMm2 >= cpcMinMm2;
    const what = armouredCpc === 'armour' ? 'Armour' : 'cpc';
    checks.push({
      code: 'adiabatic',
      ok,
      message: `${what} ${chosen.cpcMm2} mm² ${ok ? '≥' : '<'} ${fmt(cpcMinMm2, 3)} mm² (√(I²t)/k at the far-end fault current ${fmt(chosen.energyFaultA ?? 0, 0)} A; ${chosen.energyBasis}).`,
      reference:
        armouredCpc === 'armour'
          ? 'BS 7671:2018+A2:2022 543.1.3, Table 54.4'
          : 'BS 7671:2018+A2:2022 543.1.3, Table 54.3',
    });
  } else {
    checks.push({
      code: 'adiabatic',
      ok: false,
      message:
        'The fault energy cannot be found: the device does not operate in a known time at the fault current at the far end.',
      reference: 'BS 7671:2018+A2:2022 543.1.3',
    });
  }

  // Step 14: RCD for additional protection.
  const dwelling = c.dwelling ?? (c.use === 'lighting' || c.use === 'sockets');
  const reasons = additionalRcdReasons({
    use: c.use,
    inA: inA ?? ibA,
    concealedInWall: c.concealedInWall,
    dwelling,
    specialLocation: c.specialLocation,
  });
  if (reasons.length > 0) {
    const ok = rcdMa !== null && rcdMa <= 30;
    checks.push({
      code: 'rcd-additional',
      ok,
      message: `${ok ? `RCD ${rcdMa} mA present` : 'A 30 mA RCD is required'} for ${reasons.join('; ')}.`,
      reference:
        c.specialLocation === 'bath-shower'
          ? 'BS 7671:2018+A2:2022 701.411.3.3, 411.3.3'
          : 'BS 7671:2018+A2:2022 411.3.3, 411.3.4, 522.6.202',
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
    // A ring on 30/32 A: the cable's load is compared as the 20 A rule compares In (Ib × 20/In).
    const cableLoadA = ringRule && inA !== null && needA !== null ? (ibA * needA) / inA : ibA;
    if (izA !== null && cableLoadA >= NEAR_LIMIT_SHARE * izA) near.push('Ib against Iz');
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
    cpcKind: armouredCpc ?? 'core',
    disconnectionTimeS,
    adiabaticTimeS: chosen?.adiabaticTimeS ?? null,
    tableRow: row ? { table: props.table, method: c.method, csaMm2: row.csaMm2, itA: row.itA, mvAm: row.mvAm } : null,
    checks,
    verdict,
    notes,
  };
}
