import { LABEL_STATE_LOOKS } from '@/components/ui/label-state-badge';
import { wayLabelMap } from '@/lib/boards/layout';
import type { BoardDto } from '@/lib/boards/types';

/**
 * What the last label walk found: every way whose label was wrong or missing, for the
 * designer and inspector to act on. Server-rendered from the board's ways.
 */
export function LabelFindings({ board }: { board: BoardDto }) {
  const labels = wayLabelMap(board.phases, board.ways);
  const checked = board.ways.filter((w) => w.labelStatus !== 'unchecked');
  const problems = board.ways.filter((w) => w.labelStatus === 'wrong' || w.labelStatus === 'missing');
  if (!checked.length) return null;
  const Matches = LABEL_STATE_LOOKS.matches.icon;
  return (
    <section aria-labelledby="label-findings" className="rounded-card border border-line bg-paper-raised p-4">
      <h2 id="label-findings" className="mb-2 text-sm font-semibold">
        Label check
      </h2>
      {problems.length === 0 ? (
        <p className="flex items-center gap-1.5 text-sm text-verdict-pass">
          <Matches aria-hidden className="h-4 w-4" />
          {checked.length} way{checked.length === 1 ? '' : 's'} checked; every label checked so far matches.
        </p>
      ) : (
        <ul className="flex flex-col gap-1.5">
          {problems.map((way) => {
            const { icon: Icon, text } = LABEL_STATE_LOOKS[way.labelStatus];
            return (
              <li key={way.id} className="flex items-start gap-2 text-sm">
                <Icon aria-hidden className={`mt-0.5 h-4 w-4 shrink-0 ${text}`} />
                <span>
                  <strong className="font-semibold">Way {labels.get(way.id) ?? '?'}</strong>
                  {way.circuit?.serves ? ` (${way.circuit.serves})` : ''}: label{' '}
                  {way.labelStatus === 'wrong' ? 'does not match the schedule' : 'is missing'}
                  {way.labelNote ? <span className="text-ink-soft">: “{way.labelNote}”</span> : null}
                </span>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
