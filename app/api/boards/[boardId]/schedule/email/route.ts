import { printPdfBytes } from '@/features/schedule/print/print-files';
import { scheduleEmailSchema } from '@/features/schedule/types/schemas';
import { parseBody, parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { emailSchedule, getScheduleSource, listScheduleEmails } from '@/lib/dal/review';

type Params = { boardId: string };

/**
 * POST /api/boards/:boardId/schedule/email {to, revision?, message?}: sends the schedule PDF
 * through the outbox (stored, then sent and retried). Anyone who may print it may send it.
 */
export const POST = route<Params>(async (req, params) => {
  // Params, then session and role
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('schedule.print');
  // Body
  const input = await parseBody(req, scheduleEmailSchema);
  // The board state (ownership and the installers' rule in the DAL), its PDF stored or rendered
  const source = await getScheduleSource(actor, boardId, input.revision);
  const { pdf, fileName } = await printPdfBytes('schedule', source);
  // Queue the message
  const mail = await emailSchedule(actor, source, { to: input.to, message: input.message, pdf, fileName });
  return Response.json({ mail: { ...mail, to: input.to, revision: source.revision } }, { status: 202 });
});

/** GET /api/boards/:boardId/schedule/email: the schedule e-mails sent for this board, with their status. */
export const GET = route<Params>(async (_req, params) => {
  const { boardId } = parseParams(params, idParamsSchema);
  const actor = await requireActor('schedule.print');
  return Response.json({ mails: await listScheduleEmails(actor, boardId) });
});
