import { printPdfBytes } from '@/features/schedule/print/print-files';
import { scheduleEmailSchema } from '@/features/schedule/types/schemas';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { emailSchedule, listScheduleEmails } from '@/lib/dal/schedule-mail';
import { getScheduleSource } from '@/lib/dal/schedule-source';

/**
 * POST /api/boards/:boardId/schedule/email {to, revision?, message?}: sends the schedule PDF
 * through the outbox (stored, then sent and retried). Anyone who may print it may send it.
 */
export const POST = defineRoute({
  action: 'schedule.print',
  params: idParamsSchema,
  body: scheduleEmailSchema,
  handler: async ({ actor, params: { boardId }, body: input }) => {
    // The board state (ownership and the installers' rule in the DAL), its PDF stored or rendered
    const source = await getScheduleSource(actor, boardId, input.revision);
    const { pdf, fileName } = await printPdfBytes('schedule', source);
    // Queue the message
    const mail = await emailSchedule(actor, source, { to: input.to, message: input.message, pdf, fileName });
    return Response.json({ mail: { ...mail, to: input.to, revision: source.revision } }, { status: 202 });
  },
});

/** GET /api/boards/:boardId/schedule/email: the schedule e-mails sent for this board, with their status. */
export const GET = defineRoute({
  action: 'schedule.print',
  params: idParamsSchema,
  handler: async ({ actor, params: { boardId } }) => Response.json({ mails: await listScheduleEmails(actor, boardId) }),
});
