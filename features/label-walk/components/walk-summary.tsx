import { LABEL_STATE_LOOKS, LabelStateBadge } from '@/components/ui/label-state-badge';
import type { WalkData } from '@/lib/boards/walk-types';
import type { LabelStatus } from '@/lib/domain';

const COUNTED: { status: LabelStatus; words: string }[] = [
  { status: 'matches', words: 'Labels matching the schedule' },
  { status: 'wrong', words: 'Labels wrong' },
  { status: 'missing', words: 'Labels missing' },
  { status: 'unchecked', words: 'Not checked yet' },
];

/**
 * The end of a label walk: how many labels matched, each way whose label did not (with the
 * note taken), the ways not yet checked, and the photos taken. A way in the lists opens it.
 */
export function WalkSummary({ data, onGoTo }: { data: WalkData; onGoTo: (wayId: string) => void }) {
  const count = (status: LabelStatus) => data.ways.filter((w) => w.status === status).length;
  const notMatching = data.ways.filter((w) => w.status === 'wrong' || w.status === 'missing');
  const unchecked = data.ways.filter((w) => w.status === 'unchecked');
  const photos = [
    ...data.ways.flatMap((w) => w.photos.map((p) => ({ ...p, of: w.ref ? `way ${w.ref}` : w.device }))),
    ...data.boardPhotos.map((p) => ({ ...p, of: 'the board' })),
  ];
  const name = (w: WalkData['ways'][number]) => (w.ref ? `Way ${w.ref}` : w.device);

  return (
    <section aria-labelledby="walk-summary" className="space-y-4 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="walk-summary" className="text-2xl font-bold tracking-tight">
        Walk summary
      </h2>
      <dl className="grid grid-cols-2 gap-2">
        {COUNTED.map(({ status, words }) => {
          const { icon: Icon, text } = LABEL_STATE_LOOKS[status];
          return (
            <div key={status} data-summary={status} className="rounded-md border border-line bg-paper px-3 py-2">
              <dt className="flex items-center gap-1 text-xs text-ink-soft">
                <Icon aria-hidden className={`h-4 w-4 ${text}`} />
                {words}
              </dt>
              <dd className="text-2xl font-semibold tabular-nums">{count(status)}</dd>
            </div>
          );
        })}
        <div data-summary="photos" className="col-span-2 rounded-md border border-line bg-paper px-3 py-2">
          <dt className="text-xs text-ink-soft">Photos taken</dt>
          <dd className="text-2xl font-semibold tabular-nums">{photos.length}</dd>
        </div>
      </dl>

      <div className="space-y-2">
        <h3 className="text-sm font-semibold">Not matching the schedule</h3>
        {notMatching.length ? (
          <ul className="space-y-2">
            {notMatching.map((w) => (
              <li key={w.id}>
                <button
                  type="button"
                  onClick={() => onGoTo(w.id)}
                  className="flex w-full flex-col items-start gap-1 rounded-md border border-line bg-paper px-3 py-2 text-left"
                >
                  <span className="flex w-full items-center justify-between gap-2">
                    <span className="font-semibold">{name(w)}</span>
                    <LabelStateBadge status={w.status} />
                  </span>
                  <span className="text-sm">
                    Should read: {w.labelText}
                    {w.stripText ? ` (printed shortened: ${w.stripText})` : ''}
                  </span>
                  {w.note ? <span className="text-sm text-ink-soft">Note: {w.note}</span> : null}
                </button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-soft">None: every label checked matches the schedule.</p>
        )}
      </div>

      {unchecked.length ? (
        <div className="space-y-2">
          <h3 className="text-sm font-semibold">Still to check</h3>
          <ul className="flex flex-wrap gap-2">
            {unchecked.map((w) => (
              <li key={w.id}>
                <button
                  type="button"
                  onClick={() => onGoTo(w.id)}
                  className="h-10 rounded-md border border-line-strong bg-paper px-3 text-sm font-medium"
                >
                  {name(w)}
                </button>
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {photos.length ? (
        <div className="space-y-2">
          <h3 className="text-sm font-semibold">Photos</h3>
          <ul className="grid grid-cols-3 gap-2">
            {photos.map((p) => (
              <li key={p.id}>
                <a
                  href={p.url}
                  target="_blank"
                  rel="noreferrer"
                  className="block overflow-hidden rounded-md border border-line"
                >
                  {/* eslint-disable-next-line @next/next/no-img-element -- served by our own authenticated route */}
                  <img
                    src={p.thumbUrl}
                    alt={`Photo of ${p.of}: ${p.fileName}`}
                    className="aspect-square w-full object-cover"
                  />
                </a>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}
