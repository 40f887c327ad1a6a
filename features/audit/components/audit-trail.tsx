'use client';

import { useInfiniteQuery } from '@tanstack/react-query';
import { History } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { When } from '@/components/ui/when';
import { errorMessage } from '@/lib/api/client';
import { cn } from '@/lib/cn';

import { auditKeys, fetchAuditPage } from '../api/audit-api';
import { describeAuditEntry } from '../utils/describe-event';

type AuditTrailProps = {
  boardId: string;
  className?: string;
};

/**
 * A board's change history, newest first: who did what and when (ways added, moved, changed
 * or removed, saves, status changes, reviews, label checks, photos). Loads a page at a time.
 */
export function AuditTrail({ boardId, className }: AuditTrailProps) {
  const query = useInfiniteQuery({
    queryKey: auditKeys.board(boardId),
    queryFn: ({ pageParam }) => fetchAuditPage(boardId, pageParam),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextBefore,
  });
  const entries = query.data?.pages.flatMap((p) => p.entries) ?? [];

  return (
    <section aria-labelledby={`audit-${boardId}`} className={cn('flex flex-col gap-3', className)}>
      <h2 id={`audit-${boardId}`} className="flex items-center gap-2 text-base font-semibold text-ink">
        <History aria-hidden className="h-4 w-4 text-ink-faint" />
        Change history
      </h2>
      {query.isPending ? (
        <p className="text-sm text-ink-soft" aria-live="polite">
          Loading the history…
        </p>
      ) : query.isError ? (
        <ErrorState
          title="The history could not be loaded"
          message={errorMessage(query.error)}
          onRetry={() => void query.refetch()}
          retrying={query.isFetching}
        />
      ) : entries.length === 0 ? (
        <p className="text-sm text-ink-soft">No changes recorded yet.</p>
      ) : (
        <ol className="divide-y divide-line rounded-card border border-line bg-paper-raised">
          {entries.map((entry) => (
            <li key={entry.id} className="flex flex-col gap-0.5 px-4 py-2 text-sm sm:flex-row sm:gap-3">
              <When iso={entry.createdAt} className="shrink-0 tabular-nums text-ink-faint sm:w-44" />
              <span className="text-ink">
                <span className="font-medium">{entry.userName ?? 'A former member'}</span> {describeAuditEntry(entry)}
              </span>
            </li>
          ))}
        </ol>
      )}
      {query.hasNextPage ? (
        <Button
          variant="secondary"
          size="sm"
          className="self-start"
          onClick={() => void query.fetchNextPage()}
          disabled={query.isFetchingNextPage}
        >
          {query.isFetchingNextPage ? 'Loading…' : 'Show older changes'}
        </Button>
      ) : null}
    </section>
  );
}
