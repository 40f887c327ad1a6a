'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { createContext, use, useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { ApiError, errorMessage } from '@/lib/api/client';
import type { BoardDto } from '@/lib/boards/types';
import type { IssuePreview } from '@/lib/boards/review-types';

import { postComment, postReturn } from '../api/review-api';
import { commentInputSchema, type CommentInput } from '../types/schemas';
import { IssueDialog } from './issue-dialog';

/*
 * The review page's client parts besides its ways table (ways-table.tsx). The page itself is
 * rendered on the server (review-view.tsx); these are the controls that need the browser: the
 * decision (return, approve) and the comment forms.
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
