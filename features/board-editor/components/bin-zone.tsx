'use client';

import { useDroppable } from '@dnd-kit/core';
import { Trash2 } from 'lucide-react';

import { cn } from '@/lib/cn';

/** Drop a way here to take it off the board (undo brings it back). */
export function BinZone({ dragging }: { dragging: boolean }) {
  const { setNodeRef, isOver } = useDroppable({ id: 'bin', data: { to: 'bin' } });
  return (
    <div
      ref={setNodeRef}
      data-testid="bin"
      className={cn(
        'flex h-10 shrink-0 items-center justify-center gap-2 rounded-md border-2 border-dashed px-3 text-xs whitespace-nowrap transition-colors',
        isOver
          ? 'border-verdict-fail bg-verdict-fail-bg text-verdict-fail'
          : dragging
            ? 'border-verdict-fail/60 text-verdict-fail'
            : 'border-line-strong text-ink-faint',
      )}
    >
      <Trash2 aria-hidden className="h-4 w-4" />
      {isOver ? 'Let go to remove' : 'Bin: drop a way here to remove it'}
    </div>
  );
}
