import Link from 'next/link';

import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { Caution } from '@/components/ui/caution';
import { PageHeader } from '@/components/ui/page-header';
import { StatusBadge } from '@/components/ui/status-badge';
import { allows } from '@/lib/boards/lifecycle';
import type { ReviewPageData } from '@/lib/boards/review-page-data';
import type { CommentDto } from '@/lib/boards/review-types';
import { deviceName, loadTypeName } from '@/lib/names';
import { supplyInUseWords } from '@/lib/sites/supply-words';

import { CommentThread } from './comment-thread';
import {
  CommentForm,
  DecisionArea,
  DecisionButtons,
  ReturnForm,
  WayDetail,
  WayIcons,
  WaysBody,
  WayToggle,
} from './review-islands';
import { RevisionDiff } from './revision-diff';

const fmt = (v: number | null | undefined, d: number) => (v === null || v === undefined ? '—' : v.toFixed(d));

/**
 * The inspector's review of a board: every way with its sizing and comments, and the decision.
 * Rendered on the server; the browser gets the table as HTML and only the small client parts
 * of review-islands.tsx (the decision, the comment forms, opening a way, whose checks load then).
 */
export function ReviewView({
  data,
  canReview,
  canComment,
}: {
  data: ReviewPageData;
  canReview: boolean;
  canComment: boolean;
}) {
  const { board, sizing } = data;
  const results = new Map((sizing?.ways ?? []).map((w) => [w.id, w.result]));
  const fails = sizing?.summary.counts.fails ?? 0;
  // Approve and return are offered while the lifecycle allows them (in review)
  const inReview = allows(board.status, 'approve');
  const byWay = new Map<string, CommentDto[]>();
  for (const c of data.comments) if (c.wayId) byWay.set(c.wayId, [...(byWay.get(c.wayId) ?? []), c]);
  const boardSummary = { id: board.id, name: board.name, siteName: board.siteName, location: board.location };
  const supply = supplyInUseWords(board.supply, board.derivedSupply);

  return (
    <DecisionArea>
      <div className="space-y-6">
        <PageHeader
          eyebrow={
            <Link href={`/boards/${board.id}`} className="hover:text-ink">
              ← {board.name}
            </Link>
          }
          title={`Review: ${board.name}`}
          description={
            <span className="inline-flex flex-wrap items-center gap-2">
              {board.siteName}
              {board.location ? ` · ${board.location}` : ''} · revision {board.revision}{' '}
              <StatusBadge status={board.status} />
            </span>
          }
          actions={
            <>
              <Link
                href={`/boards/${board.id}/schedule`}
                className="text-sm font-medium text-copper-dark underline-offset-2 hover:underline"
              >
                Schedule
              </Link>
              {canReview && inReview ? <DecisionButtons board={boardSummary} issue={data.issue} /> : null}
            </>
          }
        />
        <Caution />
        {!inReview ? (
          <p className="rounded-md border border-line bg-paper-raised px-3 py-2 text-sm text-ink-soft">
            This board is not in review, so it cannot be approved or returned now. Comments can still be added.
          </p>
        ) : null}
        {canReview && inReview && fails > 0 ? (
          <p className="rounded-md border border-verdict-fail/30 bg-verdict-fail-bg px-3 py-2 text-sm text-ink">
            {fails} way(s) fail a check. Return the board to the designer, or issue it as it is (the confirmation asks).
          </p>
        ) : null}
        {canReview && inReview && data.issue.refusal ? (
          <p role="note" className="rounded-md border border-line bg-paper-raised px-3 py-2 text-sm text-ink">
            {data.issue.refusal.message}
          </p>
        ) : null}
        {canReview && inReview ? <ReturnForm boardId={board.id} /> : null}

        <section className="grid gap-4 rounded-card border border-line bg-paper-raised p-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Supply</h2>
            {/* What the board is sized with: carried down the site's tree when it is fed from another board */}
            <p title={supply.title}>
              {supply.supply.earthing} · Uo {supply.supply.uoV} V · {supply.values}
            </p>
            <p>
              {board.phases === 3 ? 'Three-phase' : 'Single-phase'}, {board.supply.source} supply
            </p>
          </div>
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Incoming</h2>
            <p>
              {deviceName({ kind: board.incoming.kind, ratingA: board.incoming.ratingA })}
              {board.incoming.busbarRatingA ? `, busbar ${board.incoming.busbarRatingA} A` : ''}
            </p>
            <p>{sizing?.summary.incomingCheck.message}</p>
          </div>
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Demand</h2>
            <p>Maximum demand {fmt(sizing?.summary.maxDemandA, 1)} A</p>
            <p>Connected {fmt((sizing?.summary.connectedLoadW ?? 0) / 1000, 2)} kW</p>
          </div>
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Ways</h2>
            {sizing ? (
              <p>
                {sizing.summary.counts.passes} pass, {sizing.summary.counts.nearLimit} near limit, {fails} fail,{' '}
                {sizing.summary.counts.spare} spare
              </p>
            ) : (
              <p className="text-verdict-fail">
                Not sized: {data.sizingIssues.map((i) => `${i.path}: ${i.message}`).join('; ')}
              </p>
            )}
          </div>
        </section>

        <section
          aria-labelledby="ways-heading"
          className="overflow-x-auto rounded-card border border-line bg-paper-raised"
        >
          <h2 id="ways-heading" className="sr-only">
            Ways
          </h2>
          <WayIcons />
          {/* The ways' cells are styled from the table (class `w` marks a way's row), not cell by cell */}
          <table className="w-full text-left text-sm [&_tr.w>td]:px-3 [&_tr.w>td]:py-2 [&_tr.w>td:nth-child(n+4):nth-child(-n+8)]:text-right [&_tr.w>td:nth-child(n+4):nth-child(-n+8)]:tabular-nums">
            <thead className="bg-paper-sunk text-xs text-ink-soft">
              <tr>
                <th className="px-3 py-2">Way</th>
                <th className="px-3 py-2">Serves</th>
                <th className="px-3 py-2">Device</th>
                <th className="px-3 py-2 text-right">Ib A</th>
                <th className="px-3 py-2 text-right">mm²</th>
                <th className="px-3 py-2 text-right">Iz A</th>
                <th className="px-3 py-2 text-right">Volt drop %</th>
                <th className="px-3 py-2 text-right">Zs Ω (max)</th>
                <th className="px-3 py-2">Check</th>
                <th className="px-3 py-2">Comments</th>
              </tr>
            </thead>
            <WaysBody>
              {board.ways.map((way) => {
                const r = results.get(way.id) ?? null;
                const comments = byWay.get(way.id) ?? [];
                const ref = data.refs[way.id] ?? '';
                return [
                  <tr key={way.id} className="w border-t border-line">
                    <td className="font-semibold">{ref || '—'}</td>
                    <td className={way.circuit ? undefined : 'text-ink-faint'}>
                      {way.circuit ? way.circuit.serves || '(not named)' : ref ? 'Spare' : ''}
                      {way.circuit ? (
                        <span className="block text-xs text-ink-soft">{loadTypeName(way.circuit)}</span>
                      ) : null}
                    </td>
                    <td className="text-ink-soft">{deviceName(way.device, r?.inA)}</td>
                    <td>{fmt(r?.ibA, 1)}</td>
                    <td>{r?.csaMm2 ?? '—'}</td>
                    <td>{fmt(r?.izA, 1)}</td>
                    <td>{fmt(r?.vdPct, 2)}</td>
                    <td>{r ? `${fmt(r.zsOhm, 2)} (${fmt(r.zsMaxOhm, 2)})` : '—'}</td>
                    <td>
                      {way.circuit ? (
                        r?.verdict ? (
                          <VerdictBadge verdict={r.verdict} />
                        ) : (
                          <span className="text-xs text-ink-soft">Not sized</span>
                        )
                      ) : null}
                    </td>
                    <td>
                      <WayToggle wayId={way.id} count={comments.length} refLabel={ref} />
                    </td>
                  </tr>,
                  <WayDetail
                    key={`${way.id}-detail`}
                    boardId={board.id}
                    wayId={way.id}
                    sized={!!r}
                    comments={comments}
                    canComment={canComment}
                    refLabel={ref}
                  />,
                ];
              })}
            </WaysBody>
          </table>
        </section>

        <section className="grid gap-6 lg:grid-cols-2">
          <div className="space-y-3 rounded-card border border-line bg-paper-raised p-4">
            <h2 className="text-base font-semibold">Comments on the board</h2>
            <CommentThread comments={data.comments.filter((c) => !c.wayId)} />
            {canComment ? <CommentForm boardId={board.id} wayId={null} label="Comment on the whole board" /> : null}
          </div>
          <div className="space-y-3 rounded-card border border-line bg-paper-raised p-4">
            <h2 className="text-base font-semibold">Changes between revisions</h2>
            <RevisionDiff boardId={board.id} />
          </div>
        </section>
      </div>
    </DecisionArea>
  );
}
