import { type Check, circuitInputSchema, type CircuitInput } from '@/lib/sizing';

type Loose = Record<string, unknown>;

/** A TN-C-S supply at 230 V with Ze 0.35 Ω and 1.5 kA PFC (the flat above the workshop). */
export const FLAT_SUPPLY = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' };

/** Parse a circuit through the real schema so tests exercise the same defaults as the routes. */
export function circuit(supply: Loose, c: Loose): CircuitInput {
  return circuitInputSchema.parse({ supply, circuit: c });
}

/** Find a check by code. */
export function checkOf(result: { checks: Check[] }, code: string): Check {
  const found = result.checks.find((k) => k.code === code);
  if (!found) throw new Error(`no check ${code}`);
  return found;
}
