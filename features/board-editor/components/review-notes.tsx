'use client';

import { useMutation } from '@tanstack/react-query';
import { MessageSquare } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useEffect, useRef } from 'react';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { errorMessage } from '@/lib/api/client';
import type { CommentDto, ReturnNotes } from '@/lib/boards/review-types';

import { markCommentsAnswered } from '../api/board-editor-api';
import { useWayLabels } from '../hooks/use-board-view';
import { useBoardDraftStore } from '../stores/board-draft-store';

function Meta({ comment }: { comment: CommentDto }) {
  return (
    <span className="text-xs text-ink-soft">
      {comment.authorName} · {new Date(comment.createdAt).toLocaleString('en-GB')}
    </span>
  );
}

type ReviewNotesProps = { boardId: string; notes: ReturnNotes; canAnswer: boolean };

/**
 * A returned board's review, in the editor, until the designer marks it answered: who returned
 * it and why, then each way's comments. E-mail links open the editor at #review-notes.
 */
export function ReviewNotes({ boardId, notes, canAnswer }: ReviewNotesProps) {
  const router = useRouter();
  const refs = useWayLabels();
  const ways = useBoardDraftStore((s) => s.ways);
  const select = useBoardDraftStore((s) => s.select);
  const section = useRef<HTMLElement>(null);
  useEffect(() => {
    if (window.location.hash === '#review-notes') section.current?.scrollIntoView({ block: 'start' });
  }, []);
  const ids = [...notes.reasons, ...notes.wayComments].map((c) => c.id);
  const answer = useMutation({
    mutationFn: () => markCommentsAnswered(boardId, ids),
    onSuccess: () => {
      toast.success('Review comments marked answered.');
      router.refresh();
    },
  });
  const serves = (wayId: string | null) => ways.find((w) => w.id === wayId)?.circuit?.serves;
  // Answered: the notes go at once; the page's data follows with the refresh
  if (answer.isSuccess) return null;
  return (
    <section
      id="review-notes"
      ref={section}
      aria-labelledby="review-notes-title"
      className="mb-4 rounded-card border border-verdict-near/40 bg-verdict-near-bg p-4"
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id="review-notes-title" className="flex items-center gap-2 text-base font-semibold text-ink">
            <MessageSquare aria-hidden className="h-4 w-4" /> Returned for changes
          </h2>
          <p className="text-sm text-ink-soft">
            {notes.returnedByName} returned revision {notes.revision} on{' '}
            {new Date(notes.returnedAt).toLocaleString('en-GB')}.
          </p>
        </div>
        {canAnswer ? (
          <Button size="sm" variant="secondary" onClick={() => answer.mutate()} disabled={answer.isPending}>
            {answer.isPending ? 'Marking…' : 'Mark all answered'}
          </Button>
        ) : null}
      </div>
      {notes.reasons.length ? (
        <div className="mt-3 space-y-2" data-testid="return-reason">
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Why it was returned</h3>
          {notes.reasons.map((c) => (
            <blockquote key={c.id} className="rounded-md border border-line bg-paper-raised px-3 py-2 text-sm">
              <p className="whitespace-pre-wrap text-ink">{c.body}</p>
              <Meta comment={c} />
            </blockquote>
          ))}
        </div>
      ) : null}
      {notes.wayComments.length ? (
        <div className="mt-3 space-y-2">
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">On the ways</h3>
          <ul className="space-y-2">
            {notes.wayComments.map((c) => {
              const onBoard = refs.has(c.wayId!);
              const ref = refs.get(c.wayId!);
              return (
                <li
                  key={c.id}
                  data-testid="way-comment"
                  className="rounded-md border border-line bg-paper-raised px-3 py-2 text-sm"
                >
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <span className="font-medium text-ink">
                      {onBoard ? `Way ${ref ?? '(no number)'}` : 'A way since removed'}
                      {serves(c.wayId) ? ` · ${serves(c.wayId)}` : ''}
                    </span>
                    {onBoard ? (
                      <button
                        type="button"
                        className="text-xs font-medium text-copper-dark underline-offset-2 hover:underline"
                        onClick={() => select(c.wayId)}
                      >
                        Show the way
                      </button>
                    ) : null}
                  </div>
                  <p className="whitespace-pre-wrap text-ink">{c.body}</p>
                  <Meta comment={c} />
                </li>
              );
            })}
          </ul>
        </div>
      ) : null}
      {answer.isError ? <FormAlert className="mt-3">{errorMessage(answer.error)}</FormAlert> : null}
    </section>
  );
}

/** The review comments on the selected way, shown above the way panel. */
export function SelectedWayComments({ notes }: { notes: ReturnNotes }) {
  const selection = useBoardDraftStore((s) => s.selection);
  const refs = useWayLabels();
  const mine = notes.wayComments.filter((c) => c.wayId && selection.includes(c.wayId));
  if (!mine.length) return null;
  return (
    <aside
      aria-label="Review comments on this way"
      className="mb-3 rounded-card border border-verdict-near/40 bg-verdict-near-bg p-3 text-sm"
    >
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">
        Reviewer on way {refs.get(mine[0].wayId!) ?? ''}
      </h3>
      <ul className="mt-1 space-y-1">
        {mine.map((c) => (
          <li key={c.id}>
            <p className="whitespace-pre-wrap text-ink">{c.body}</p>
            <Meta comment={c} />
          </li>
        ))}
      </ul>
    </aside>
  );
}
