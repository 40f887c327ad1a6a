'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery } from '@tanstack/react-query';
import { CircleCheck, CircleX } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { createContext, use, useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { ApiError, errorMessage } from '@/lib/api/client';
import type { BoardDto } from '@/lib/boards/types';
import type { CommentDto, IssuePreview } from '@/lib/boards/review-types';

import { fetchWayChecks, postComment, postReturn, reviewKeys } from '../api/review-api';
import { commentInputSchema, type CommentInput } from '../types/schemas';
import { CommentThread } from './comment-thread';
import { IssueDialog } from './issue-dialog';

/*
 * The review page's client parts. The page itself is rendered on the server
 * (review-view.tsx); these are the few controls that need the browser: the decision
 * (return, approve), the comment forms, and opening a way (its checks load then).
 */

/** Whether the return form is open: shared by the header's button and the form below it. */
const ReturningContext = createContext<{ returning: boolean; setReturning: (v: boolean) => void }>({
  returning: false,
  setReturning: () => {},
});

/** Holds the decision's state for the buttons in the header and the return form below. */
export function DecisionArea({ children }: { children: React.ReactNode }) {
  const [returning, setReturning] = useState(false);
  return <ReturningContext value={{ returning, setReturning }}>{children}</ReturningContext>;
}

/** Return to draft and Approve and issue, with the issue confirmation. */
export function DecisionButtons({
  board,
  issue,
}: {
  board: Pick<BoardDto, 'id' | 'name' | 'siteName' | 'location'>;
  issue: IssuePreview;
}) {
  const { returning, setReturning } = use(ReturningContext);
  const [issuing, setIssuing] = useState(false);
  return (
    <>
      <Button variant="secondary" onClick={() => setReturning(!returning)}>
        Return to draft
      </Button>
      <Button onClick={() => setIssuing(true)} disabled={!!issue.refusal}>
        Approve and issue
      </Button>
      <IssueDialog open={issuing} onClose={() => setIssuing(false)} board={board} issue={issue} />
    </>
  );
}

/** The return form, shown when Return to draft is pressed. */
export function ReturnForm({ boardId }: { boardId: string }) {
  const router = useRouter();
  const { returning, setReturning } = use(ReturningContext);
  const [closing, setClosing] = useState('');
  const giveBack = useMutation({
    mutationFn: () => postReturn(boardId, { comment: closing.trim() || undefined }),
    onSuccess: () => {
      toast.success('Returned to draft. The designer has been e-mailed.');
      setReturning(false);
      setClosing('');
      router.refresh();
    },
  });
  const returnIssue =
    giveBack.error instanceof ApiError ? giveBack.error.issues.find((i) => i.path === 'comment') : undefined;
  if (!returning) return null;
  return (
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
  );
}

/** A comment on the board (wayId null) or on one way. */
export function CommentForm({ boardId, wayId, label }: { boardId: string; wayId: string | null; label: string }) {
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

/** Which way of the table is open (one at a time). */
const OpenWayContext = createContext<{ open: string | null; setOpen: (id: string | null) => void }>({
  open: null,
  setOpen: () => {},
});

/** The ways table's body: its rows are rendered on the server; this holds which one is open. */
export function WaysBody({ children }: { children: React.ReactNode }) {
  const [open, setOpen] = useState<string | null>(null);
  return (
    <OpenWayContext value={{ open, setOpen }}>
      <tbody>{children}</tbody>
    </OpenWayContext>
  );
}

/**
 * The icons of the ways' buttons, drawn once per page (lucide's chevron-right, chevron-down and
 * message-square) and used by each row through `<use>`: a row carries a short reference instead
 * of the icon's whole markup, which on a 36-way board was a fifth of the page.
 */
export function WayIcons() {
  const stroke = {
    fill: 'none',
    stroke: 'currentColor',
    strokeWidth: 2,
    strokeLinecap: 'round',
    strokeLinejoin: 'round',
  } as const;
  return (
    <svg aria-hidden className="absolute h-0 w-0 overflow-hidden">
      <symbol id="way-icon-closed" viewBox="0 0 24 24" {...stroke}>
        <path d="m9 18 6-6-6-6" />
      </symbol>
      <symbol id="way-icon-open" viewBox="0 0 24 24" {...stroke}>
        <path d="m6 9 6 6 6-6" />
      </symbol>
      <symbol id="way-icon-comments" viewBox="0 0 24 24" {...stroke}>
        <path d="M22 17a2 2 0 0 1-2 2H6.828a2 2 0 0 0-1.414.586l-2.202 2.202A.71.71 0 0 1 2 21.286V5a2 2 0 0 1 2-2h16a2 2 0 0 1 2 2z" />
      </symbol>
    </svg>
  );
}

/** The button that opens a way: its checks and comments. */
export function WayToggle({ wayId, count, refLabel }: { wayId: string; count: number; refLabel: string }) {
  const { open, setOpen } = use(OpenWayContext);
  const expanded = open === wayId;
  return (
    <button
      type="button"
      aria-expanded={expanded}
      onClick={() => setOpen(expanded ? null : wayId)}
      className="inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-ink-soft hover:bg-paper-sunk hover:text-ink"
    >
      <svg aria-hidden className="h-4 w-4">
        <use href={expanded ? '#way-icon-open' : '#way-icon-closed'} />
      </svg>
      <svg aria-hidden className="h-3.5 w-3.5">
        <use href="#way-icon-comments" />
      </svg>{' '}
      {count}
      <span className="sr-only">comments on way {refLabel}</span>
    </button>
  );
}

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

/** The opened way's row: its checks (loaded now) and its comments, with the form to add one. */
export function WayDetail({
  boardId,
  wayId,
  sized,
  comments,
  canComment,
  refLabel,
}: {
  boardId: string;
  wayId: string;
  /** Whether the way has a circuit with a sizing (else there is nothing to check). */
  sized: boolean;
  comments: CommentDto[];
  canComment: boolean;
  refLabel: string;
}) {
  const { open } = use(OpenWayContext);
  if (open !== wayId) return null;
  return (
    <tr className="bg-paper">
      <td colSpan={10} className="px-3 py-3">
        <div className="grid gap-4 md:grid-cols-2">
          <div>
            {sized ? (
              <Checks boardId={boardId} wayId={wayId} />
            ) : (
              <p className="text-sm text-ink-faint">No circuit to check.</p>
            )}
          </div>
          <div className="space-y-3">
            <CommentThread comments={comments} />
            {canComment ? <CommentForm boardId={boardId} wayId={wayId} label={`Comment on way ${refLabel}`} /> : null}
          </div>
        </div>
      </td>
    </tr>
  );
}
