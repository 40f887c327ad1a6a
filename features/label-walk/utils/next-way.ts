import type { LabelStatus } from '@/lib/domain';

/**
 * Where the walk goes next: the first way not yet checked after `from` (wrapping round to
 * the start), or `from` itself when every way has been checked.
 */
export function nextUnchecked(statuses: readonly LabelStatus[], from: number): number {
  for (let step = 1; step <= statuses.length; step += 1) {
    const i = (from + step) % statuses.length;
    if (statuses[i] === 'unchecked') return i;
  }
  return from;
}

/** Where a walk resumes: the first way not yet checked, else the first way. */
export function resumeAt(statuses: readonly LabelStatus[]): number {
  const i = statuses.indexOf('unchecked');
  return i === -1 ? 0 : i;
}
