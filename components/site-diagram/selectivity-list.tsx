import { selectivitySummary, selectivityWords } from '@/lib/names';
import type { SelectivityGroup } from '@/lib/sites/tree-types';
import { placesWords } from '@/lib/supply/group-selectivity';

/**
 * Selectivity between the sub-main's device and the devices below it, folded away: one line per
 * judgement with the ways it covers, and its working. Advisory: never a failure of the board
 * (the site marks a board near the limit while any judgement is not selective throughout). The
 * summary counts the judgements by outcome.
 */
export function SelectivityList({ groups, className }: { groups: readonly SelectivityGroup[]; className?: string }) {
  return (
    <details className={className ?? 'mt-1 text-xs text-ink-soft'}>
      <summary className="cursor-pointer hover:text-ink">
        Selectivity below the sub-main (advisory): {selectivitySummary(groups.map((g) => g.outcome))}
      </summary>
      {/* Paragraphs, not a list: it sits inside an item of the site's board list */}
      <div className="mt-1 space-y-1.5 pl-4">
        {groups.map((g, i) => (
          <p key={i}>
            <span className="text-ink">
              {g.upstream} above {g.device}
              {g.places.length ? ` (${placesWords(g.places)})` : ''}: {selectivityWords(g.outcome, g.upToA)}
            </span>
            <span className="block">{g.working.text}</span>
            <span className="block text-ink-faint">Basis: {g.working.sources.join('; ')}</span>
          </p>
        ))}
      </div>
    </details>
  );
}
