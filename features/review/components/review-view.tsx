'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { ChevronDown, ChevronRight, CircleCheck, CircleX, MessageSquare } from 'lucide-react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { Fragment, useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';

import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { PageHeader } from '@/components/ui/page-header';
import { StatusBadge } from '@/components/ui/status-badge';
import { When } from '@/components/ui/when';
import { ApiError, errorMessage } from '@/lib/api/client';
import { allows } from '@/lib/boards/lifecycle';
import { deviceName, loadTypeName } from '@/lib/names';
import type { CommentDto } from '@/lib/boards/review-types';
import type { ReviewPageData, ReviewWayResult } from '@/lib/boards/review-page-data';

import { postComment, postReturn } from '../api/review-api';
import { commentInputSchema, type CommentInput } from '../types/schemas';
import { IssueDialog } from './issue-dialog';
import { RevisionDiff } from './revision-diff';

const fmt = (v: number | null | undefined, d: number) => (v === null || v === undefined ? '—' : v.toFixed(d));

function CommentThread({ comments }: { comments: CommentDto[] }) {
  if (!comments.length) return <p className="text-sm text-ink-faint">No comments yet.</p>;
  return (
    <ul className="space-y-2">
      {comments.map((c) => (
        <li key={c.id} className="rounded-md border border-line bg-paper px-3 py-2 text-sm">
          <div className="text-xs text-ink-soft">
            {c.authorName} · revision {c.revision} · <When iso={c.createdAt} />
          </div>
          <p className="whitespace-pre-wrap text-ink">{c.body}</p>
        </li>
      ))}
    </ul>
  );
}

function CommentForm({ boardId, wayId, label }: { boardId: string; wayId: string | null; label: string }) {
  const router = useRouter();
  const form = useForm<CommentInput>({ resolver: zodResolver(commentInputSchema), defaultValues: { wayId, body: '' } });
  const send = useMutation({
    mutationFn: (input: CommentInput) => postComment(boardId, input),
    onSuccess: () => {
      form.reset({ wayId, body: '' });
      router.refresh();
    },
  });
  const error = form.formState.errors.body?.message;
  return (
    <form className="space-y-2" onSubmit={form.handleSubmit((v) => send.mutate(v))} noValidate>
      <label className="block text-sm font-medium text-ink">
        {label}
        <textarea
          {...form.register('body')}
          rows={2}
          aria-invalid={!!error}
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm focus:border-copper focus:outline-none"
        />
      </label>
      {error ? <p className="text-xs font-medium text-verdict-fail">{error}</p> : null}
      {send.isError ? <FormAlert>{errorMessage(send.error)}</FormAlert> : null}
      <Button type="submit" size="sm" variant="secondary" disabled={send.isPending}>
        {send.isPending ? 'Adding…' : 'Add comment'}
      </Button>
    </form>
  );
}

function Checks({ result }: { result: ReviewWayResult }) {
  return (
    <ul className="space-y-1 text-xs">
      {result.checks.map((c) => (
        <li key={c.code} className="flex items-start gap-1.5">
          {c.ok ? (
            <CircleCheck aria-hidden className="mt-0.5 h-3.5 w-3.5 shrink-0 text-verdict-pass" />
          ) : (
            <CircleX aria-hidden className="mt-0.5 h-3.5 w-3.5 shrink-0 text-verdict-fail" />
          )}
          <span>
            <span className="sr-only">{c.ok ? 'Met: ' : 'Not met: '}</span>
            {c.message} <span className="text-ink-faint">({c.reference})</span>
          </span>
        </li>
      ))}
    </ul>
  );
}

/** The inspector's review of a board: every way with its sizing and comments, and the decision. */
export function ReviewView({
  data,
  canReview,
  canComment,
}: {
  data: ReviewPageData;
  canReview: boolean;
  canComment: boolean;
}) {
  const router = useRouter();
  const { board, sizing } = data;
  const [open, setOpen] = useState<string | null>(null);
  const [returning, setReturning] = useState(false);
  const [closing, setClosing] = useState('');
  const [issuing, setIssuing] = useState(false);
  const results = new Map((sizing?.ways ?? []).map((w) => [w.id, w.result]));
  const fails = sizing?.summary.counts.fails ?? 0;
  // Approve and return are offered while the lifecycle allows them (in review)
  const inReview = allows(board.status, 'approve');

  const giveBack = useMutation({
    mutationFn: () => postReturn(board.id, { comment: closing.trim() || undefined }),
    onSuccess: () => {
      toast.success('Returned to draft. The designer has been e-mailed.');
      setReturning(false);
      setClosing('');
      router.refresh();
    },
  });
  const returnIssue =
    giveBack.error instanceof ApiError ? giveBack.error.issues.find((i) => i.path === 'comment') : undefined;

  return (
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
            {canReview && inReview ? (
              <>
                <Button variant="secondary" onClick={() => setReturning((v) => !v)}>
                  Return to draft
                </Button>
                <Button onClick={() => setIssuing(true)} disabled={!!data.issue.refusal}>
                  Approve and issue
                </Button>
              </>
            ) : null}
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
      {canReview && inReview ? (
        <IssueDialog open={issuing} onClose={() => setIssuing(false)} board={board} issue={data.issue} />
      ) : null}
      {returning ? (
        <div className="space-y-2 rounded-card border border-line bg-paper-raised p-4">
          <label className="block text-sm font-medium text-ink">
            What needs changing (sent to the designer with the comments below)
            <textarea
              value={closing}
              onChange={(e) => setClosing(e.target.value)}
              rows={3}
              aria-invalid={!!returnIssue}
              className="mt-1 w-full rounded-md border border-line-strong bg-paper px-3 py-2 text-sm focus:border-copper focus:outline-none"
            />
          </label>
          {giveBack.isError ? <FormAlert>{returnIssue?.message ?? errorMessage(giveBack.error)}</FormAlert> : null}
          <Button variant="danger" onClick={() => giveBack.mutate()} disabled={giveBack.isPending}>
            {giveBack.isPending ? 'Returning…' : 'Return with comments'}
          </Button>
        </div>
      ) : null}

      <section className="grid gap-4 rounded-card border border-line bg-paper-raised p-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
        <div>
          <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Supply</h2>
          <p>
            {board.supply.earthing} · Uo {board.supply.uoV} V · Ze {board.supply.zeOhm} Ω · PFC {board.supply.pfcKa} kA
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
        <table className="w-full text-left text-sm">
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
          <tbody>
            {board.ways.map((way) => {
              const r = results.get(way.id) ?? null;
              const comments = data.comments.filter((c) => c.wayId === way.id);
              const expanded = open === way.id;
              return (
                <Fragment key={way.id}>
                  <tr className="border-t border-line">
                    <td className="px-3 py-2 font-semibold">{data.refs[way.id] ?? '—'}</td>
                    <td className={way.circuit ? 'px-3 py-2' : 'px-3 py-2 text-ink-faint'}>
                      {way.circuit ? way.circuit.serves || '(not named)' : data.refs[way.id] ? 'Spare' : ''}
                      {way.circuit ? (
                        <span className="block text-xs text-ink-soft">{loadTypeName(way.circuit)}</span>
                      ) : null}
                    </td>
                    <td className="px-3 py-2 text-ink-soft">{deviceName(way.device, r?.inA)}</td>
                    <td className="px-3 py-2 text-right tabular-nums">{fmt(r?.ibA, 1)}</td>
                    <td className="px-3 py-2 text-right tabular-nums">{r?.csaMm2 ?? '—'}</td>
                    <td className="px-3 py-2 text-right tabular-nums">{fmt(r?.izA, 1)}</td>
                    <td className="px-3 py-2 text-right tabular-nums">{fmt(r?.vdPct, 2)}</td>
                    <td className="px-3 py-2 text-right tabular-nums">
                      {r ? `${fmt(r.zsOhm, 2)} (${fmt(r.zsMaxOhm, 2)})` : '—'}
                    </td>
                    <td className="px-3 py-2">
                      {way.circuit ? (
                        r?.verdict ? (
                          <VerdictBadge verdict={r.verdict} />
                        ) : (
                          <span className="text-xs text-ink-soft">Not sized</span>
                        )
                      ) : null}
                    </td>
                    <td className="px-3 py-2">
                      <button
                        type="button"
                        aria-expanded={expanded}
                        onClick={() => setOpen(expanded ? null : way.id)}
                        className="inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-ink-soft hover:bg-paper-sunk hover:text-ink"
                      >
                        {expanded ? (
                          <ChevronDown aria-hidden className="h-4 w-4" />
                        ) : (
                          <ChevronRight aria-hidden className="h-4 w-4" />
                        )}
                        <MessageSquare aria-hidden className="h-3.5 w-3.5" /> {comments.length}
                        <span className="sr-only">comments on way {data.refs[way.id] ?? ''}</span>
                      </button>
                    </td>
                  </tr>
                  {expanded ? (
                    <tr className="bg-paper">
                      <td colSpan={10} className="px-3 py-3">
                        <div className="grid gap-4 md:grid-cols-2">
                          <div>
                            {r ? <Checks result={r} /> : <p className="text-sm text-ink-faint">No circuit to check.</p>}
                          </div>
                          <div className="space-y-3">
                            <CommentThread comments={comments} />
                            {canComment ? (
                              <CommentForm
                                boardId={board.id}
                                wayId={way.id}
                                label={`Comment on way ${data.refs[way.id] ?? ''}`}
                              />
                            ) : null}
                          </div>
                        </div>
                      </td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })}
          </tbody>
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
  );
}
