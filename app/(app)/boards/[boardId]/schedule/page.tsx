import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { z } from 'zod';

import { EmptyState } from '@/components/ui/empty-state';
import { ScheduleSheet } from '@/features/schedule/components/schedule-sheet';
import { ScheduleToolbar } from '@/features/schedule/components/schedule-toolbar';
import { printQuerySchema } from '@/features/schedule/types/schemas';
import { buildSchedule } from '@/features/schedule/utils/build-schedule';
import { boardQrCode } from '@/features/schedule/utils/qr-code';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';
import { listRevisions } from '@/lib/dal/revisions';
import { getScheduleSource } from '@/lib/dal/schedule-source';
import { HttpError } from '@/lib/errors';

export const metadata = { title: 'Schedule' };

// Printing this page prints the schedule alone: everything that neither holds the sheet nor lies
// inside it (the app's bar, the board's tabs, the toolbar, toasts) is left out, the boxes around
// the sheet lose their padding, and the sheet's shading (the table header, the group bands) prints.
const PRINT_CSS = `
@page { size: A4 landscape; margin: 10mm; }
@media print {
  body :not(:has([data-print-root])):not([data-print-root]):not([data-print-root] *) { display: none !important; }
  body :has([data-print-root]) {
    margin: 0 !important; padding: 0 !important; gap: 0 !important; max-width: none !important;
    border: 0 !important; box-shadow: none !important; background: none !important;
  }
  [data-print-root], [data-print-root] * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}`;

/** The board schedule in the browser, printable; the same data as the PDF. */
export default async function SchedulePage({
  params,
  searchParams,
}: {
  params: Promise<{ boardId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { boardId } = await params;
  const actor = await getActor();
  if (!actor) redirect('/login');
  if (!z.uuid().safeParse(boardId).success) notFound();
  const query = printQuerySchema.safeParse(await searchParams);
  if (!query.success) notFound();
  if (!can(actor.role, 'schedule.print')) notFound();
  // Only the reads may answer 404 or 403. The page is drawn after them, never inside a try:
  // React renders later, so a try around JSX catches nothing from it.
  const loaded = await Promise.all([
    getScheduleSource(actor, boardId, query.data.revision),
    listRevisions(actor, boardId),
  ]).catch((err: unknown) => {
    if (err instanceof HttpError && (err.status === 404 || err.status === 403)) return err;
    throw err;
  });
  if (loaded instanceof HttpError) {
    if (loaded.status === 404) notFound();
    return (
      <EmptyState title="No issued schedule yet">
        {loaded.message} The schedule can be printed once the board is issued.
      </EmptyState>
    );
  }
  const [source, { revisions, current: stage }] = loaded;
  const data = buildSchedule(source);
  const choices = [
    ...(can(actor.role, 'schedule.print-draft') && !revisions.some((r) => r.revision === stage.revision)
      ? [{ revision: stage.revision, label: `Revision ${stage.revision} (draft)` }]
      : []),
    ...revisions.map((r) => ({ revision: r.revision, label: `Revision ${r.revision} (issued)` })),
  ];
  return (
    <div className="space-y-4">
      <style>{PRINT_CSS}</style>
      <div className="flex items-center justify-between print:hidden">
        <Link href={`/boards/${boardId}`} className="text-sm text-ink-soft hover:text-ink">
          ← {data.boardName}
        </Link>
        <h1 className="text-lg font-semibold">Schedule, revision {data.revision}</h1>
      </div>
      <ScheduleToolbar boardId={boardId} revision={data.revision} choices={choices} />
      <ScheduleSheet data={data} qrDataUrl={await boardQrCode(data.boardUrl)} />
    </div>
  );
}
