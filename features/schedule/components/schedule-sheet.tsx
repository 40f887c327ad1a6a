import type { ScheduleData } from '../utils/build-schedule';
import { ScheduleTable } from './schedule-table';

/** The board schedule as a web page, from the same data as the PDF; prints on A4 landscape. */
export function ScheduleSheet({ data, qrDataUrl }: { data: ScheduleData; qrDataUrl: string }) {
  return (
    <article
      data-print-root
      className="rounded-card border border-line bg-paper-raised p-5 text-[13px] print:border-0 print:p-0 print:text-[9px]"
    >
      <header className="flex flex-wrap gap-6 border-b-2 border-ink pb-3">
        <div className="min-w-56 flex-1">
          <p className="text-xs uppercase tracking-wide text-ink-soft">{data.organisationName}</p>
          <p className="mt-1 text-sm font-semibold text-copper">Board schedule</p>
          <h2 className="text-2xl font-bold">{data.boardName}</h2>
          <p className="text-ink-soft">
            {data.siteName}
            {data.location ? ` · ${data.location}` : ''}
          </p>
        </div>
        {[data.supply, data.document].map((facts, i) => (
          <dl key={i} className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 border-l border-line pl-4">
            {facts.map((f) => (
              <div key={f.label} className="contents">
                <dt className="text-ink-soft">{f.label}</dt>
                <dd className="font-semibold">{f.value}</dd>
              </div>
            ))}
          </dl>
        ))}
        {/* eslint-disable-next-line @next/next/no-img-element -- a data URL made on the server */}
        <img src={qrDataUrl} alt={`QR code linking to ${data.boardUrl}`} className="h-24 w-24" />
      </header>
      {data.draft ? (
        <p className="mt-2 rounded bg-verdict-fail-bg px-2 py-1 font-semibold text-verdict-fail">
          Draft, revision {data.revision}: not issued. Do not build or label a board from this print.
        </p>
      ) : null}
      <p className="mt-2 text-xs text-ink-soft print:text-[8px]">{data.designValuesNote}</p>
      <ScheduleTable columns={data.columns} groups={data.groups} />
      <div className="mt-4 grid gap-6 md:grid-cols-[1fr_2fr] print:grid-cols-[1fr_2fr]">
        <section>
          <h3 className="mb-1 font-semibold">Totals</h3>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
            {data.totals.map((t) => (
              <div key={t.label} className="contents">
                <dt className="text-ink-soft">{t.label}</dt>
                <dd className="font-semibold">{t.value}</dd>
              </div>
            ))}
          </dl>
        </section>
        <section>
          <h3 className="mb-1 font-semibold">Notices for this board</h3>
          <ul className="space-y-1.5">
            {data.notices.map((n) => (
              <li key={n.title} className="border-l-2 border-copper pl-2">
                <strong>{n.title}.</strong> {n.text}
              </li>
            ))}
          </ul>
          <p className="mt-1.5 text-xs text-ink-soft print:text-[8px]">{data.noticesNote}</p>
        </section>
      </div>
      {data.designNotes.length ? (
        <section className="mt-4">
          <h3 className="mb-1 font-semibold">Checks not met in the design</h3>
          <ul className="list-disc pl-5 text-verdict-fail">
            {data.designNotes.map((n, i) => (
              <li key={i}>{n}</li>
            ))}
          </ul>
        </section>
      ) : null}
      <p role="note" className="mt-4 border-t border-line pt-2 text-xs print:text-[8px]">
        <strong>Caution.</strong> {data.caution}
      </p>
    </article>
  );
}
