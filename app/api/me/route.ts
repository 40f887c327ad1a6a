import { route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';

/** GET /api/me: who is signed in (also the trivial route the benchmarks compare against). */
export const GET = route(async () => {
  const actor = await requireActor();
  return Response.json({ user: actor });
});
