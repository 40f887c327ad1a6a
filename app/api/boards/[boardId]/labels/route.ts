import { pdfHeaders, renderLabelStripsPdf } from '@/features/schedule/render-schedule';
import { parsePrintQuery } from '@/features/schedule/utils/print-query';
import { parseParams, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getScheduleSource } from '@/lib/dal/schedule-source';

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
  // Render
  const { pdf, fileName } = await renderLabelStripsPdf(source);
  return new Response(pdf as BodyInit, { headers: pdfHeaders(fileName, query.download === '1') });
});
