import type { ReviewData } from '@/lib/boards/review-types';
import type { BoardSummary, CircuitResult } from '@/lib/sizing';

/** The parts of a way's sizing the review page's table shows (its checks load when the way is opened). */
export type ReviewWayResult = Pick<
  CircuitResult,
  'ibA' | 'inA' | 'csaMm2' | 'izA' | 'vdPct' | 'zsOhm' | 'zsMaxOhm' | 'verdict'
>;

/** A way's checks as the review page shows them when the way is opened. */
export type WayChecks = Pick<CircuitResult['checks'][number], 'code' | 'ok' | 'message' | 'reference'>[];

/** A way's checks cut to what the review page shows (GET /api/boards/:id/sizing/ways/:wayId). */
export function wayChecksOf(result: Pick<CircuitResult, 'checks'> | null): WayChecks {
  return (result?.checks ?? []).map(({ code, ok, message, reference }) => ({ code, ok, message, reference }));
}

/** The parts of a board's sizing the review page shows. */
export type ReviewSizing = {
  ways: { id: string; result: ReviewWayResult | null }[];
  summary: Pick<BoardSummary, 'connectedLoadW' | 'maxDemandA' | 'counts'> & {
    incomingCheck: { message: string };
  };
};

/** The review page's props: the review, its sizing cut to what the page shows. */
export type ReviewPageData = Omit<ReviewData, 'sizing'> & { sizing: ReviewSizing | null };

/**
 * The review cut to what the page shows: the engine's working (factors, table rows, notes, RCD
 * coverage…) and each way's checks (loaded when a way is opened) stay out of the page.
 */
export function reviewPageData(data: ReviewData): ReviewPageData {
  const { sizing } = data;
  return {
    ...data,
    sizing: sizing && {
      ways: sizing.ways.map(({ id, result: r }) => ({
        id,
        result: r && {
          ibA: r.ibA,
          inA: r.inA,
          csaMm2: r.csaMm2,
          izA: r.izA,
          vdPct: r.vdPct,
          zsOhm: r.zsOhm,
          zsMaxOhm: r.zsMaxOhm,
          verdict: r.verdict,
        },
      })),
      summary: {
        connectedLoadW: sizing.summary.connectedLoadW,
        maxDemandA: sizing.summary.maxDemandA,
        counts: sizing.summary.counts,
        incomingCheck: { message: sizing.summary.incomingCheck.message },
      },
    },
  };
}
