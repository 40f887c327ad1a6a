import { defineRoute } from '@/lib/api/handler';

/** GET /api/me: who is signed in (also the trivial route the benchmarks compare against). */
export const GET = defineRoute({
  action: 'signed-in',
  scope: 'none',
  handler: async ({ actor }) => Response.json({ user: actor }),
});
