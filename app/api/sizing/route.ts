import { defineRoute } from '@/lib/api/handler';
import { circuitInputSchema, sizeCircuit } from '@/lib/sizing';

/** POST /api/sizing: one circuit sized (quick size). The body is the engine's circuit input. */
export const POST = defineRoute({
  action: 'sizing.run',
  scope: 'none',
  // Validated with the engine's schema
  body: circuitInputSchema,
  handler: async ({ body }) => Response.json({ result: sizeCircuit(body) }),
});
