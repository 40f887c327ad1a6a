import Link from 'next/link';

import { Caution } from '@/components/ui/caution';
import { PageHeader } from '@/components/ui/page-header';
import { StatusBadge } from '@/components/ui/status-badge';
import { allows } from '@/lib/boards/lifecycle';
import type { ReviewPageData } from '@/lib/boards/review-page-data';
import { deviceName, fedFromWords } from '@/lib/names';
import { pct, supplyInUseWords } from '@/lib/sites/supply-words';

import { CommentThread } from './comment-thread';
import { CommentForm, DecisionArea, DecisionButtons, ReturnForm } from './review-islands';
import { RevisionDiff } from './revision-diff';
import { ReviewSelectivity } from './review-selectivity';
import { WaysTable } from './ways-table';

const fmt = (v: number | null | undefined, d: number) => (v === null || v === undefined ? '—' : v.toFixed(d));

/**
 * The inspector's review of a board: every way with its sizing and comments, and the decision.
 * Rendered on the server, except the ways table, which the browser draws from its rows
 * (ways-table.tsx), and the small client parts of review-islands.tsx (the decision, the comment
 * forms).
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
  const { board, summary } = data;
  const fails = summary?.counts.fails ?? 0;
  // Approve and return are offered while the lifecycle allows them (in review)
  const inReview = allows(board.status, 'approve');
  const boardSummary = { id: board.id, name: board.name, siteName: board.siteName, location: board.location };
  const supply = supplyInUseWords(board.supply, board.derivedSupply);
  // Fed from another board's way: where from, and what the sub-mains above used of the volt drop
  const fed = board.derivedSupply?.from === 'way' && !board.derivedSupply.problem ? board.derivedSupply : null;

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
            {fed ? (
              <p>
                Fed from {fedFromWords(fed.fedFrom)}
                {fed.vdUsed ? ` · volt drop used above ${pct(fed.vdUsed.value)}` : ''}
              </p>
            ) : null}
          </div>
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Incoming</h2>
            <p>
              {deviceName({ kind: board.incoming.kind, ratingA: board.incoming.ratingA })}
              {board.incoming.busbarRatingA ? `, busbar ${board.incoming.busbarRatingA} A` : ''}
            </p>
            <p>{summary?.incomingCheck.message}</p>
          </div>
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Demand</h2>
            <p>Maximum demand {fmt(summary?.maxDemandA, 1)} A</p>
            <p>Connected {fmt((summary?.connectedLoadW ?? 0) / 1000, 2)} kW</p>
          </div>
          <div>
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Ways</h2>
            {summary ? (
              <p>
                {summary.counts.passes} pass, {summary.counts.nearLimit} near limit, {fails} fail,{' '}
                {summary.counts.spare} spare
              </p>
            ) : (
              <p className="text-verdict-fail">
                Not sized: {data.sizingIssues.map((i) => `${i.path}: ${i.message}`).join('; ')}
              </p>
            )}
          </div>
          {fed ? (
            <div className="sm:col-span-2 lg:col-span-4">
              <ReviewSelectivity siteId={board.siteId} boardId={board.id} />
            </div>
          ) : null}
          {summary?.failing.length ? (
            <div className="sm:col-span-2 lg:col-span-4">
              <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Board checks that fail</h2>
              <ul className="list-disc pl-5 text-verdict-fail">
                {summary.failing.map((message) => (
                  <li key={message}>{message}</li>
                ))}
              </ul>
            </div>
          ) : null}
        </section>

        <section
          aria-labelledby="ways-heading"
          // relative: the table's screen-reader-only words are placed inside this scrolling box,
          // not beside it, where they made a phone's page wider than the screen
          className="relative overflow-x-auto rounded-card border border-line bg-paper-raised"
        >
          <h2 id="ways-heading" className="sr-only">
            Ways
          </h2>
          <WaysTable boardId={board.id} rows={data.rows} canComment={canComment} />
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
