import { pdfResponse, printPdf } from '@/features/schedule/print/print-files';
import { parsePrintQuery } from '@/features/schedule/utils/print-query';
import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getScheduleSource } from '@/lib/dal/review';

/**
 * GET /api/boards/:boardId/labels[?revision=N][&download=1]: printable way labels sized to
 * the module pitch, in rail order. The same revisions as the schedule may be printed.
 */
export const GET = route<{ boardId: string }>(async (req, params) => {
  // Params and query
  const { boardId } = parseParams(params, idParamsSchema);
  const query = parsePrintQuery(req.url);
  // Session and role
  const actor = await requireActor('schedule.print');
  // The board state (ownership and the installers' rule in the DAL)
  const source = await getScheduleSource(actor, boardId, query.revision);
  // The stored file of an issued revision, else rendered in the print pool (and stored when issued)
  return pdfResponse(await printPdf('labels', source), query.download === '1');
});
