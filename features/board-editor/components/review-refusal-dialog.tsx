'use client';

import { CircleX } from 'lucide-react';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';

import type { FailingWay } from '@/lib/boards/review-types';

type ReviewRefusalDialogProps = {
  refusal: { message: string; failing: FailingWay[] } | null;
  onShowWays: (ids: string[]) => void;
  onClose: () => void;
};

/** Why a board could not go for review: each failing way and what it fails. */
export function ReviewRefusalDialog({ refusal, onShowWays, onClose }: ReviewRefusalDialogProps) {
  return (
    <ConfirmDialog
      open={!!refusal}
      danger={false}
      wide
      title="Not sent for review"
      description={refusal?.message}
      cancelLabel="Close"
      confirmLabel="Show them on the board"
      onClose={onClose}
      onConfirm={() => onShowWays(refusal?.failing.map((w) => w.wayId) ?? [])}
    >
      <ul className="max-h-[50vh] space-y-3 overflow-y-auto">
        {refusal?.failing.map((w) => (
          <li key={w.wayId} className="rounded-md border border-verdict-fail/30 bg-verdict-fail-bg/50 px-3 py-2">
            <div className="flex items-center gap-2 text-sm font-semibold text-verdict-fail">
              <CircleX aria-hidden className="h-4 w-4" />
              {w.label ? `Way ${w.label}` : 'A device'}
              {w.serves ? <span className="font-normal text-ink">· {w.serves}</span> : null}
            </div>
            <ul className="mt-1 list-disc pl-6 text-sm text-ink">
              {w.problems.map((p, i) => (
                <li key={i}>{p}</li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </ConfirmDialog>
  );
}
