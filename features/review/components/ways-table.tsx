'use client';

import { useQuery } from '@tanstack/react-query';
import { ChevronDown, ChevronRight, CircleCheck, CircleX, MessageSquare } from 'lucide-react';
import { Fragment, useState } from 'react';

import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { FormAlert } from '@/components/ui/form-alert';
import { errorMessage } from '@/lib/api/client';
import type { ReviewWayRow } from '@/lib/boards/review-page-data';

import { fetchWayChecks, reviewKeys } from '../api/review-api';
import { useInBrowser } from '@/lib/use-in-browser';
import { CommentThread } from './comment-thread';
import { CommentForm } from './review-islands';

const NUMBER_HEADINGS = ['Ib A', 'mm²', 'Iz A', 'Volt drop % (max)', 'Zs Ω (max)'];

/** A way's checks, loaded when the way is opened. */
function Checks({ boardId, wayId }: { boardId: string; wayId: string }) {
  const checks = useQuery({
    queryKey: reviewKeys.wayChecks(boardId, wayId),
    queryFn: () => fetchWayChecks(boardId, wayId),
  });
  if (checks.isPending) return <p className="text-sm text-ink-soft">Loading the checks…</p>;
  if (checks.isError) return <FormAlert>{errorMessage(checks.error)}</FormAlert>;
  return (
    <ul className="space-y-1 text-xs" data-testid="way-checks">
      {checks.data.map((c) => (
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

/**
 * Every way of the board with its sizing in figures and its verdict; opening a way shows its
 * checks (loaded then) and its comments, with the form to add one. One way is open at a time.
 */
export function WaysTable({
  boardId,
  rows,
  canComment,
}: {
  boardId: string;
  rows: ReviewWayRow[];
  canComment: boolean;
}) {
  const inBrowser = useInBrowser();
  const [open, setOpen] = useState<string | null>(null);
  if (!inBrowser) {
    return (
      // Holds about the table's height so that the page does not jump when it is drawn
      <p className="px-3 py-3 text-sm text-ink-soft" style={{ minHeight: `${(rows.length + 1) * 41}px` }}>
        {`Loading ${rows.length} ways…`}
        <noscript> The table of ways needs JavaScript; the printed schedule has the same figures.</noscript>
      </p>
    );
  }
  return (
    <table className="w-full text-left text-sm">
      <thead className="bg-paper-sunk text-xs text-ink-soft">
        <tr>
          <th className="px-3 py-2">Way</th>
          <th className="px-3 py-2">Serves</th>
          <th className="px-3 py-2">Device</th>
          {NUMBER_HEADINGS.map((h) => (
            <th key={h} className="px-3 py-2 text-right">
              {h}
            </th>
          ))}
          <th className="px-3 py-2">Check</th>
          <th className="px-3 py-2">Comments</th>
        </tr>
      </thead>
      <tbody className="[&_tr.w>td]:px-3 [&_tr.w>td]:py-2 [&_tr.w>td:nth-child(n+4):nth-child(-n+8)]:text-right [&_tr.w>td:nth-child(n+4):nth-child(-n+8)]:tabular-nums [&_tr.w>td:nth-child(n+4):nth-child(-n+8)]:whitespace-nowrap">
        {rows.map((way) => {
          const expanded = open === way.id;
          return (
            <Fragment key={way.id}>
              <tr className="w border-t border-line">
                <td className="font-semibold">{way.ref || '—'}</td>
                <td className={way.serves === null ? 'text-ink-faint' : undefined}>
                  {way.serves ?? (way.ref ? 'Spare' : '')}
                  {way.loadType ? <span className="block text-xs text-ink-soft">{way.loadType}</span> : null}
                </td>
                <td className="text-ink-soft">{way.device}</td>
                {way.figures.map((f, i) => (
                  <td key={i}>{f}</td>
                ))}
                <td>
                  {way.serves === null ? null : way.verdict ? (
                    <VerdictBadge verdict={way.verdict} />
                  ) : (
                    <span className="text-xs text-ink-soft">Not sized</span>
                  )}
                </td>
                <td>
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
                    <MessageSquare aria-hidden className="h-3.5 w-3.5" /> {way.comments.length}
                    <span className="sr-only">comments on way {way.ref}</span>
                  </button>
                </td>
              </tr>
              {expanded ? (
                <tr className="bg-paper">
                  <td colSpan={10} className="px-3 py-3">
                    <div className="grid gap-4 md:grid-cols-2">
                      <div>
                        {way.sized ? (
                          <Checks boardId={boardId} wayId={way.id} />
                        ) : (
                          <p className="text-sm text-ink-faint">No circuit to check.</p>
                        )}
                      </div>
                      <div className="space-y-3">
                        <CommentThread comments={way.comments} />
                        {canComment ? (
                          <CommentForm boardId={boardId} wayId={way.id} label={`Comment on way ${way.ref}`} />
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
  );
}
