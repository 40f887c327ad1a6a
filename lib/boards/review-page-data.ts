import type { CommentDto, ReviewData } from '@/lib/boards/review-types';
import { deviceName, loadTypeName, vdLimitText } from '@/lib/names';
import type { BoardResult, BoardSummary, CircuitResult, Verdict } from '@/lib/sizing';

/** A way's checks as the review page shows them when the way is opened. */
export type WayChecks = Pick<CircuitResult['checks'][number], 'code' | 'ok' | 'message' | 'reference'>[];

/** A way's checks cut to what the review page shows (GET /api/boards/:id/sizing/ways/:wayId). */
export function wayChecksOf(result: Pick<CircuitResult, 'checks'> | null): WayChecks {
  return (result?.checks ?? []).map(({ code, ok, message, reference }) => ({ code, ok, message, reference }));
}

/** One row of the review page's ways table, in words and figures ready to show. */
export type ReviewWayRow = {
  id: string;
  /** The printed way reference ('' for a device without one, such as a main switch). */
  ref: string;
  /** What the way's circuit serves; null when the way has no circuit. */
  serves: string | null;
  /** The circuit's kind of load, in words; null when the way has no circuit. */
  loadType: string | null;
  device: string;
  /** Ib A, mm², Iz A, volt drop % and Zs Ω each with its limit in brackets ('—' where there is none). */
  figures: [string, string, string, string, string];
  /** Whether the way has a sizing (a circuit the engine sized), so checks to open. */
  sized: boolean;
  verdict: Verdict | null;
  comments: CommentDto[];
};

/** The parts of a board's sizing summary the review page shows; `failing`: the board's checks that fail. */
export type ReviewSummary = Pick<BoardSummary, 'connectedLoadW' | 'maxDemandA' | 'counts'> & {
  incomingCheck: { message: string };
  failing: string[];
};

/** The summary as the review page reads it: its board checks cut to those that fail (or all of them). */
type ReviewSummarySource = Omit<ReviewSummary, 'failing'> & { checks: { ok: boolean; message: string }[] };

/** The parts of a way's sizing the review page's table shows (its checks load when the way is opened). */
export type ReviewWayResult = Pick<
  CircuitResult,
  'ibA' | 'inA' | 'csaMm2' | 'izA' | 'vdPct' | 'vdLimitPct' | 'zsOhm' | 'zsMaxOhm' | 'verdict'
>;

/**
 * The shape of the stored cut (`board_sizings.review`): a stored cut of another shape is not
 * current, so the board is sized again and its cut stored by its first read
 * (lib/dal/board-repository.ts `CURRENT_SIZING`). 2: each way's volt drop limit.
 */
export const REVIEW_CUT = 2;

/** A board's sizing cut to what the review page shows: the engine's whole answer is one too. */
export type ReviewSizing = {
  cut?: number;
  ways: { id: string; result: ReviewWayResult | null }[];
  summary: ReviewSummarySource;
};

/** What the review page is made from: the review, its sizing whole or cut to what the page shows. */
export type ReviewSource = Omit<ReviewData, 'sizing'> & { sizing: ReviewSizing | null };

/** The review page's props: the review, with its sizing cut to the table's rows and the summary. */
export type ReviewPageData = Omit<ReviewData, 'sizing'> & { summary: ReviewSummary | null; rows: ReviewWayRow[] };

/**
 * A sizing cut to what the review page shows (stored beside it, migration 0015): each way's
 * figures and verdict, the board's summary and, of its checks, those that fail.
 */
export function reviewSizingOf(sizing: Pick<BoardResult, 'ways' | 'summary'>): ReviewSizing {
  const { connectedLoadW, maxDemandA, counts, incomingCheck, checks } = sizing.summary;
  return {
    cut: REVIEW_CUT,
    summary: {
      connectedLoadW,
      maxDemandA,
      counts,
      incomingCheck: { message: incomingCheck.message },
      checks: checks.filter((c) => !c.ok).map(({ ok, message }) => ({ ok, message })),
    },
    ways: sizing.ways.map(({ id, result: r }) => ({
      id,
      result: r && {
        ibA: r.ibA,
        inA: r.inA,
        csaMm2: r.csaMm2,
        izA: r.izA,
        vdPct: r.vdPct,
        vdLimitPct: r.vdLimitPct,
        zsOhm: r.zsOhm,
        zsMaxOhm: r.zsMaxOhm,
        verdict: r.verdict,
      },
    })),
  };
}

const fmt = (v: number | null | undefined, d: number) => (v === null || v === undefined ? '—' : v.toFixed(d));

/**
 * The review cut to what the page shows: each way as a row of words and figures (the engine's
 * working, factors, table rows and notes stay on the server; a way's checks load when it is
 * opened) and the board's summary.
 */
export function reviewPageData(data: ReviewSource): ReviewPageData {
  const { sizing, board } = data;
  const results = new Map((sizing?.ways ?? []).map((w) => [w.id, w.result]));
  const byWay = new Map<string, CommentDto[]>();
  for (const c of data.comments) if (c.wayId) byWay.set(c.wayId, [...(byWay.get(c.wayId) ?? []), c]);
  const rows = board.ways.map((way): ReviewWayRow => {
    const r = results.get(way.id) ?? null;
    return {
      id: way.id,
      ref: data.refs[way.id] ?? '',
      serves: way.circuit ? way.circuit.serves || '(not named)' : null,
      loadType: way.circuit ? loadTypeName(way.circuit) : null,
      device: deviceName(way.device, r?.inA),
      figures: [
        fmt(r?.ibA, 1),
        r?.csaMm2 === undefined || r?.csaMm2 === null ? '—' : String(r.csaMm2),
        fmt(r?.izA, 1),
        // The limit of a board fed from another is what the sub-mains above left of the origin's
        r ? `${fmt(r.vdPct, 2)} (${vdLimitText(r.vdLimitPct)})` : '—',
        r ? `${fmt(r.zsOhm, 2)} (${fmt(r.zsMaxOhm, 2)})` : '—',
      ],
      sized: !!r,
      verdict: (way.circuit && r?.verdict) || null,
      comments: byWay.get(way.id) ?? [],
    };
  });
  const { sizing: _full, ...rest } = data;
  return {
    ...rest,
    rows,
    summary: sizing && {
      connectedLoadW: sizing.summary.connectedLoadW,
      maxDemandA: sizing.summary.maxDemandA,
      counts: sizing.summary.counts,
      incomingCheck: { message: sizing.summary.incomingCheck.message },
      failing: sizing.summary.checks.filter((c) => !c.ok).map((c) => c.message),
    },
  };
}
