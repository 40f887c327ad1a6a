'use client';

import { useQuery } from '@tanstack/react-query';
import { useId, useState } from 'react';

import { ErrorState } from '@/components/ui/error-state';
import { Select } from '@/components/ui/field';
import { errorMessage } from '@/lib/api/client';

import { fetchDiff, fetchRevisions, reviewKeys } from '../api/review-api';
import { useInBrowser } from '@/lib/use-in-browser';
import { RevisionDiffView } from './revision-diff-view';

/**
 * What changed between two revisions of a board (or an issued revision and the live
 * draft), with pickers for both. Self-contained, so the board page can embed it.
 */
export function RevisionDiff({ boardId }: { boardId: string }) {
  // Its revisions load in the browser: the server renders what it would show until then
  if (!useInBrowser()) return <p className="text-sm text-ink-soft">Loading revisions…</p>;
  return <RevisionPickers boardId={boardId} />;
}

function RevisionPickers({ boardId }: { boardId: string }) {
  const id = useId();
  const list = useQuery({ queryKey: reviewKeys.revisions(boardId), queryFn: () => fetchRevisions(boardId) });
  const [picked, setPicked] = useState<{ from?: string; to?: string }>({});

  // Defaults: the live draft against the last issue, or the last issue against the one before
  const issued = list.data?.revisions ?? [];
  const liveIsIssued = issued.some((r) => r.revision === list.data?.current.revision);
  const options = [
    ...(liveIsIssued
      ? []
      : [{ value: 'current', label: `Revision ${list.data?.current.revision ?? ''} (live draft)` }]),
    ...issued.map((r) => ({ value: String(r.revision), label: `Revision ${r.revision} (issued)` })),
  ];
  const to = picked.to ?? options[0]?.value;
  const from = picked.from ?? options[1]?.value;
  const diff = useQuery({
    queryKey: reviewKeys.diff(boardId, from ?? '', to ?? ''),
    queryFn: () => fetchDiff(boardId, from!, to!),
    enabled: !!from && !!to,
  });

  if (list.isError) return <ErrorState message={errorMessage(list.error)} onRetry={() => list.refetch()} />;
  if (list.isPending) return <p className="text-sm text-ink-soft">Loading revisions…</p>;
  if (options.length < 2) {
    return <p className="text-sm text-ink-soft">Nothing to compare yet: the board has no earlier issued revision.</p>;
  }
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-from`} className="text-xs font-medium text-ink-soft">
            From
          </label>
          <Select id={`${id}-from`} value={from} onChange={(e) => setPicked((p) => ({ ...p, from: e.target.value }))}>
            {options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </Select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-to`} className="text-xs font-medium text-ink-soft">
            To
          </label>
          <Select id={`${id}-to`} value={to} onChange={(e) => setPicked((p) => ({ ...p, to: e.target.value }))}>
            {options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </Select>
        </div>
      </div>
      {diff.isError ? <ErrorState message={errorMessage(diff.error)} onRetry={() => diff.refetch()} /> : null}
      {diff.data ? (
        <RevisionDiffView diff={diff.data} />
      ) : diff.isFetching ? (
        <p className="text-sm text-ink-soft">Comparing…</p>
      ) : null}
    </div>
  );
}
