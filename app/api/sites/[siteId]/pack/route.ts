import { z } from 'zod';

import { defineRoute } from '@/lib/api/handler';

import { composeSitePack } from './compose';

const params = z.object({ siteId: z.uuid() });

/**
 * GET /api/sites/:siteId/pack[?download=1]: the site pack, one PDF: the single-line diagram and
 * the values carried to each board, then each board's schedule (issued file where issued, else
 * the draft). Admins, designers and inspectors (it prints drafts).
 */
export const GET = defineRoute({
  action: 'schedule.print-draft',
  params,
  query: z.object({ download: z.enum(['1']).optional() }).strict(),
  handler: async ({ actor, params: { siteId }, query }) => {
    const { pdf, fileName } = await composeSitePack(actor, siteId);
    return new Response(pdf as BodyInit, {
      headers: {
        'Content-Type': 'application/pdf',
        'Content-Disposition': `${query.download ? 'attachment' : 'inline'}; filename="${fileName}"`,
        'Content-Length': String(pdf.byteLength),
        'Cache-Control': 'private, no-store',
      },
    });
  },
});
