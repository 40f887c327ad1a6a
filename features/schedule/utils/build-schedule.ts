/**
 * Turns a board state (an issued revision or the live draft) into the rows, groups,
 * totals and notices of the printed board schedule. Pure: the PDF and the browser print
 * view both draw what this returns, so they always say the same thing.
 */
import { countWays, countWords } from '@/lib/boards/counts';
import { layoutWays, railOrder } from '@/lib/boards/layout';
import { rcdProtection, type RcdProtector } from '@/lib/boards/rcd-protection';
import { type SnapshotWay } from '@/lib/boards/revision-diff';
import {
  BOARD_STATUS_NAMES,
  CABLE_CELL_NAMES,
  deviceName,
  EARTHING_NAMES,
  LABEL_STATUS_NAMES,
  loadTypeName,
  nameWaysIn,
  vdLimitText,
  VERDICT_WORDS,
  wayTitle,
} from '@/lib/names';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { SIZING_CAUTION, type CircuitResult, type Verdict } from '@/lib/sizing';
import type { LabelStatus } from '@/lib/domain';

import type { ColumnKey, ScheduleColumn, ScheduleGroup, ScheduleRow } from '../types/schedule-table';

/**
 * Boardwright's own columns, in the order a designer reasons about a way: what it is and
 * feeds, its protection, its load, the cable, then the checks and the verdict. R1+R2 and Zs
 * are the design's calculated values, never readings: their headings say so, and every sheet
 * carries `DESIGN_VALUES_NOTE`.
 */
export const SCHEDULE_COLUMNS: readonly ScheduleColumn[] = [
  { key: 'way', heading: 'Way', width: 40, align: 'left' },
  { key: 'serves', heading: 'Serves', width: 96, align: 'left' },
  { key: 'load', heading: 'Kind of load', width: 54, align: 'left' },
  { key: 'protection', heading: 'Protection', width: 92, align: 'left' },
  { key: 'ib', heading: 'Ib A', width: 34, align: 'right' },
  { key: 'cable', heading: 'Cable, method', width: 78, align: 'left' },
  { key: 'conductors', heading: 'Line / cpc mm²', width: 50, align: 'right' },
  { key: 'run', heading: 'Run m', width: 32, align: 'right' },
  { key: 'iz', heading: 'Iz A', width: 34, align: 'right' },
  { key: 'vd', heading: 'Volt drop % (limit)', width: 52, align: 'right' },
  { key: 'r1r2', heading: 'Design R1+R2 Ω', width: 40, align: 'right' },
  // The line break keeps "(limit)" whole in the narrow PDF heading (a web page shows a space)
  { key: 'zs', heading: 'Design Zs Ω\n(limit)', width: 54, align: 'right' },
  { key: 'result', heading: 'Design check', width: 58, align: 'left' },
  { key: 'label', heading: 'Label on site', width: 70, align: 'left' },
];

export type ScheduleFact = { label: string; value: string };

export type ScheduleNotice = { title: string; text: string };

/** The line every sheet prints under the table: the values are the design's, not readings. */
export const DESIGN_VALUES_NOTE =
  'Design R1+R2 and Zs are calculated from this design (cable, length and the tables), not measured: they are not test results. Record readings from testing on the installation certificate.';

/** The notices' own reminder that they stand in for nothing BS 7671 asks for at the board. */
export const NOTICES_NOTE =
  'These notices are a reminder only: they do not replace the notices and labels BS 7671 requires at the board (Section 514), which must be fitted there.';

export type ScheduleData = {
  organisationName: string;
  boardName: string;
  siteName: string;
  location: string;
  boardUrl: string;
  revision: number;
  draft: boolean;
  statusWord: string;
  supply: ScheduleFact[];
  document: ScheduleFact[];
  columns: ScheduleColumn[];
  groups: ScheduleGroup[];
  totals: ScheduleFact[];
  notices: ScheduleNotice[];
  noticesNote: string;
  designNotes: string[];
  designValuesNote: string;
  caution: string;
  fileName: string;
};

// The mark printed before a verdict or a label result, so that it reads without colour
const VERDICT_MARKS: Record<Verdict, string> = { passes: '✓', 'near-limit': '!', fails: '✗' };
const LABEL_MARKS: Record<LabelStatus, string> = { unchecked: '', matches: '✓', wrong: '✗', missing: '✗' };
const marked = (mark: string, words: string) => (mark ? `${mark} ${words}` : words);

/** A number with fixed decimals, or a dash when there is none. */
export function num(value: number | null | undefined, decimals: number): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : value.toFixed(decimals);
}

/** "12 Mar 2026" in the UK's time zone. */
export function formatDate(iso: string): string {
  return DATE_FORMAT.format(new Date(iso));
}

// Made once: making an Intl.DateTimeFormat costs a tenth of a millisecond or more, and every
// issued print's storage key formats today's date (storedKey in print/print-files.ts)
const DATE_FORMAT = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'Europe/London',
});

function protectionText(way: SnapshotWay, result: CircuitResult | null): string {
  const text = deviceName(way.device, result?.inA);
  const parts = [text];
  if (way.device.poles > 1 && way.device.kind !== 'blank') parts.push(`${way.device.poles}P`);
  if (way.device.breakingKa) parts.push(`${way.device.breakingKa} kA`);
  return parts.join(' · ');
}

function emptyCells(): Record<ColumnKey, string> {
  return Object.fromEntries(SCHEDULE_COLUMNS.map((c) => [c.key, '—'])) as Record<ColumnKey, string>;
}

function labelCell(label: { status: LabelStatus; note: string } | undefined): string {
  if (!label) return '—';
  const word = marked(LABEL_MARKS[label.status], LABEL_STATUS_NAMES[label.status]);
  return label.note && label.status !== 'unchecked' ? `${word}: ${label.note}` : word;
}

/** One row of the schedule for a device with a way number (or an SPD). */
function rowFor(
  way: SnapshotWay,
  ref: string | null,
  result: CircuitResult | null,
  label: { status: LabelStatus; note: string } | undefined,
): ScheduleRow {
  const cells = emptyCells();
  cells.way = ref ?? '—';
  cells.protection = protectionText(way, result);
  cells.label = labelCell(label);
  const c = way.circuit;
  if (!c) {
    const spare =
      way.device.kind === 'blank'
        ? 'Spare (blank)'
        : way.device.kind === 'spd'
          ? 'Surge protection'
          : 'Spare (device fitted)';
    cells.serves = spare;
    if (way.device.kind === 'blank') cells.protection = '—';
    return { wayId: way.id, cells, verdict: null, spare: way.device.kind !== 'spd', label: label?.status ?? null };
  }
  cells.serves = c.serves?.trim() || '(not named)';
  cells.load = loadTypeName(c);
  cells.cable = `${CABLE_CELL_NAMES[c.cable] ?? 'Cable'}, method ${c.method}`;
  cells.run = num(c.lengthM, 0);
  if (result) {
    cells.ib = num(result.ibA, 1);
    cells.conductors = result.csaMm2 ? `${result.csaMm2} / ${result.cpcMm2 ?? '—'}` : '—';
    cells.iz = num(result.izA, 1);
    cells.vd = result.vdPct === null ? '—' : `${num(result.vdPct, 2)} (${vdLimitText(result.vdLimitPct)})`;
    cells.r1r2 = num(result.r1r2Ohm, 3);
    cells.zs = result.zsOhm === null ? '—' : `${num(result.zsOhm, 2)} (${num(result.zsMaxOhm, 2)})`;
    cells.result = marked(VERDICT_MARKS[result.verdict], VERDICT_WORDS[result.verdict]);
  }
  return { wayId: way.id, cells, verdict: result?.verdict ?? null, spare: false, label: label?.status ?? null };
}

/**
 * The heading of a run of ways with the same RCD protection (rcd-protection.ts): the RCD on
 * the rail, the incoming RCD, the ways' own RCBOs, or none after a main switch.
 */
function groupHeading(
  protector: RcdProtector,
  rcd: SnapshotWay | undefined,
  mainSwitch: SnapshotWay | null,
  incoming: ScheduleSource['snapshot']['settings']['incoming'],
): string {
  if (protector?.by === 'rcd' && rcd) {
    const d = rcd.device;
    return `${deviceName(d)}${d.rcdType ? `, type ${d.rcdType}` : ''}: RCD protection for the ways below`;
  }
  if (protector?.by === 'incoming') {
    return `Incoming ${deviceName({ kind: 'rcd', ratingA: incoming.ratingA })}: RCD protection for the ways below`;
  }
  if (protector?.by === 'own') return 'RCBOs: each way below has its own RCD protection';
  if (mainSwitch) {
    return `${deviceName(mainSwitch.device)}, ${mainSwitch.device.poles}-pole: the ways below have no RCD protection`;
  }
  return 'Ways fed straight from the incoming device, without RCD protection';
}

function incomingText(incoming: ScheduleSource['snapshot']['settings']['incoming']): string {
  const busbar = incoming.busbarRatingA ? ` · busbar ${incoming.busbarRatingA} A` : '';
  return `${deviceName({ kind: incoming.kind, ratingA: incoming.ratingA })}${busbar}`;
}

/** The notices the board calls for, in the spirit of BS 7671 Section 514 (our own words). */
export function noticesFor(source: ScheduleSource): ScheduleNotice[] {
  const { settings, ways } = source.snapshot;
  const notices: ScheduleNotice[] = [];
  const hasRcd =
    settings.incoming.kind === 'rcd' || ways.some((w) => w.device.kind === 'rcd' || w.device.kind === 'rcbo');
  // BS 7671:2018+A2:2022 514.12.2 asks for a notice on RCD testing (six-monthly since A2; from memory)
  if (hasRcd) {
    notices.push({
      title: 'Test the RCDs',
      text: 'This board has residual current devices (RCDs or RCBOs). Press the test button on each one every six months: it must switch off. Switch it back on afterwards. If one does not switch off, ask an electrician to check it.',
    });
  }
  // 514.12.1: a notice of periodic inspection (from memory)
  notices.push({
    title: 'Periodic inspection',
    text: 'Have this installation inspected and tested periodically by a competent person; the date of the next inspection is on the installation certificate.',
  });
  // 514.10.1: a warning where more than 230 V is present between parts (from memory)
  if (settings.phases === 3) {
    notices.push({
      title: '400 V inside',
      text: 'Three-phase board: 400 V is present between the phases inside this enclosure. Isolate all three phases before removing covers.',
    });
  }
  if (settings.supply.earthing === 'TT') {
    notices.push({
      title: 'TT earthing',
      text: 'Fault protection relies on the RCDs and the installation earth electrode. Do not disconnect the earthing conductor or bypass an RCD.',
    });
  }
  if (ways.some((w) => w.device.kind === 'spd')) {
    notices.push({
      title: 'Surge protection',
      text: 'A surge protective device is fitted. Check its status indicator at every inspection and replace it when it shows the end of its life.',
    });
  }
  if (!source.frozen) {
    notices.push({
      title: 'Not issued',
      text: `This is revision ${source.revision} as drafted, not an issued schedule. Do not build or label a board from it.`,
    });
  }
  return notices;
}

/** The schedule of a board state: header facts, grouped rows, totals, notices and caution. */
export function buildSchedule(source: ScheduleSource, now = new Date()): ScheduleData {
  const { settings, ways } = source.snapshot;
  const ordered = railOrder(ways);
  const refs = new Map(layoutWays(settings.phases, ordered).map((p) => [p.id, p.label]));
  const results = new Map((source.sizing?.ways ?? []).map((w) => [w.id, w.result]));
  const labels = source.labels ?? {};
  const walked = Object.values(labels).some((l) => l.status !== 'unchecked');

  // Rows in rail order, grouped by what gives them RCD protection (the one rule of
  // rcd-protection.ts, the engine's too); a main switch or an RCD ends a group, an SPD stays in it
  const protection = rcdProtection(ordered, settings.incoming.kind === 'rcd');
  const byId = new Map(ordered.map((w) => [w.id, w]));
  const groups: ScheduleGroup[] = [];
  let mainSwitch: SnapshotWay | null = null;
  let groupKey: string | null = null;
  const seen = new Set<string>();
  for (const way of ordered) {
    if (way.device.kind === 'main-switch') mainSwitch = way;
    if (way.device.kind === 'main-switch' || way.device.kind === 'rcd') {
      groupKey = null;
      continue;
    }
    const protector = protection.get(way.id) ?? null;
    const key: string =
      way.device.kind === 'spd' && groupKey !== null
        ? groupKey
        : protector?.by === 'rcd'
          ? `rcd:${protector.rcdId}`
          : protector
            ? protector.by
            : `none:${mainSwitch?.id ?? ''}`;
    if (key !== groupKey) {
      const rcd = protector?.by === 'rcd' ? byId.get(protector.rcdId) : undefined;
      const heading = groupHeading(protector, rcd, mainSwitch, settings.incoming);
      // A run that resumes after an RCBO says so, rather than restating its device as if it were another
      const again = key !== 'own' && seen.has(key);
      groups.push({ heading: again ? `${heading.split(':')[0]} (continued)` : heading, rows: [] });
      seen.add(key);
      groupKey = key;
    }
    const row = rowFor(way, refs.get(way.id) ?? null, results.get(way.id) ?? null, walked ? labels[way.id] : undefined);
    groups[groups.length - 1].rows.push(row);
  }
  const filled = groups.filter((g) => g.rows.length);

  // Totals: the ways counted by way number (counts.ts, as the boards list and the editor), then the sizing's
  const s = source.sizing?.summary;
  const totals: ScheduleFact[] = [{ label: 'Ways', value: countWords(countWays(settings.phases, ordered)) }];
  if (s) {
    totals.push(
      { label: 'Connected load', value: `${num(s.connectedLoadW / 1000, 2)} kW` },
      { label: 'Maximum demand (after diversity)', value: `${num(s.maxDemandA, 1)} A` },
    );
    if (s.phaseCurrentsA) {
      totals.push({
        label: 'Per phase',
        value: `L1 ${num(s.phaseCurrentsA.L1, 1)} A · L2 ${num(s.phaseCurrentsA.L2, 1)} A · L3 ${num(s.phaseCurrentsA.L3, 1)} A${s.imbalancePct !== null ? ` · imbalance ${num(s.imbalancePct, 0)} %` : ''}`,
      });
    }
    totals.push(
      {
        label: 'Design checks',
        value: `${s.counts.passes} pass, ${s.counts.nearLimit} near limit, ${s.counts.fails} fail`,
      },
      { label: 'Modules', value: `${s.modulesUsed} of ${s.enclosureModules} used` },
      {
        label: 'Incoming device',
        value: `${deviceName({ kind: settings.incoming.kind, ratingA: settings.incoming.ratingA })}, ${
          s.incomingCheck.ok ? 'not less than' : 'less than'
        } the maximum demand of ${num(s.maxDemandA, 1)} A`,
      },
    );
  }
  if (walked) {
    const all = Object.values(labels);
    const count = (st: LabelStatus) => all.filter((l) => l.status === st).length;
    totals.push({
      label: 'Label walk',
      value: `${count('matches')} match, ${count('wrong')} wrong, ${count('missing')} missing, ${count('unchecked')} not checked`,
    });
  }

  // Design notes: every failed check, so the schedule never hides one
  const designNotes: string[] = [];
  for (const way of ordered) {
    const r = results.get(way.id);
    if (!r) continue;
    for (const c of r.checks.filter((x) => !x.ok)) {
      const ref = refs.get(way.id);
      designNotes.push(
        `${ref ? wayTitle(ref) : deviceName(way.device)}: ${nameWaysIn(c.message, refs)} (${c.reference})`,
      );
    }
  }
  for (const c of s?.checks.filter((x) => !x.ok) ?? [])
    designNotes.push(`Board: ${nameWaysIn(c.message, refs)} (${c.reference})`);
  for (const issue of source.sizingIssues) designNotes.push(`Not sized: ${nameWaysIn(issue.message, refs)}`);

  const columns = SCHEDULE_COLUMNS.filter((c) => c.key !== 'label' || walked);
  const issued = source.issued ? `${formatDate(source.issued.at)} by ${source.issued.byName}` : 'Not issued';
  const slug =
    settings.name
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() || 'board';
  return {
    organisationName: source.snapshot.organisationName,
    boardName: settings.name,
    siteName: source.snapshot.siteName,
    location: settings.location,
    boardUrl: source.boardUrl,
    revision: source.revision,
    draft: !source.frozen,
    statusWord: source.frozen ? BOARD_STATUS_NAMES[source.status] : `${BOARD_STATUS_NAMES[source.status]} (not issued)`,
    supply: [
      { label: 'Earthing', value: EARTHING_NAMES[settings.supply.earthing] ?? settings.supply.earthing },
      { label: 'Uo', value: `${settings.supply.uoV} V` },
      // A board fed from another board is frozen with what the site's tree carried down to it
      ...(source.snapshot.fedFrom
        ? [
            { label: 'Fed from', value: source.snapshot.fedFrom },
            { label: 'Zdb (carried)', value: `${num(settings.supply.zeOhm, 3)} Ω` },
            { label: 'PFC (carried)', value: `${num(settings.supply.pfcKa, 2)} kA` },
            // What the sub-mains above used of the volt drop: the final circuits' limit is less by it
            // (the label fits the PDF header's 50 pt label column on one line: 47 pt at 7 pt)
            ...(settings.supply.vdUsedPct
              ? [{ label: 'Vd used above', value: `${num(settings.supply.vdUsedPct, 2)} %` }]
              : []),
          ]
        : [
            { label: 'Ze', value: `${settings.supply.zeOhm} Ω` },
            { label: 'PFC', value: `${settings.supply.pfcKa} kA` },
          ]),
      {
        label: 'Phases',
        value: `${settings.phases === 3 ? 'Three-phase' : 'Single-phase'}, ${settings.supply.source} supply`,
      },
      { label: 'Incoming', value: incomingText(settings.incoming) },
    ],
    document: [
      { label: 'Revision', value: String(source.revision) },
      {
        label: 'Status',
        value: source.frozen ? BOARD_STATUS_NAMES[source.status] : `${BOARD_STATUS_NAMES[source.status]} (not issued)`,
      },
      { label: 'Issued', value: issued },
      { label: 'Printed', value: formatDate(now.toISOString()) },
      {
        label: 'Enclosure',
        value: `${settings.enclosureModules} modules, ${settings.rails} rail${settings.rails > 1 ? 's' : ''}`,
      },
    ],
    columns,
    groups: filled,
    totals,
    notices: noticesFor(source),
    noticesNote: NOTICES_NOTE,
    designNotes,
    designValuesNote: DESIGN_VALUES_NOTE,
    caution: SIZING_CAUTION,
    fileName: `schedule-${slug}-rev${source.revision}${source.frozen ? '' : '-draft'}.pdf`,
  };
}
