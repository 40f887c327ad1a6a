import { parseBody, route } from '@/lib/api/handler';
import { requireActor } from '@/lib/auth/session';
import { circuitInputSchema, sizeCircuit } from '@/lib/sizing';

/** POST /api/sizing: one circuit sized (quick size). The body is the engine's circuit input. */
export const POST = route(async (req) => {
  // Session and role
  await requireActor('sizing.run');
  // Body, validated with the engine's schema
  const input = await parseBody(req, circuitInputSchema);
  // The engine
  return Response.json({ result: sizeCircuit(input) });
});
