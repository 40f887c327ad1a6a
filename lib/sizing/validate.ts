import type { z } from 'zod';

import {
  boardInputSchema,
  circuitInputSchema,
  supplySchema,
  waySchema,
  type BoardInput,
  type CircuitInput,
  type EngineWayInput,
} from './schemas';

/** One field the engine refused: its path (dot-separated) and why. */
export interface SizingInputIssue {
  path: string;
  message: string;
}

/**
 * The engine was called with input its schema refuses (a negative length, a 400 V Uo, ...).
 * The message names every bad field; `issues` lists them one by one.
 */
export class SizingInputError extends Error {
  readonly issues: SizingInputIssue[];
  constructor(issues: SizingInputIssue[]) {
    super(`Invalid sizing input: ${issues.map((i) => `${i.path || '(input)'}: ${i.message}`).join('; ')}`);
    this.name = 'SizingInputError';
    this.issues = issues;
  }
}

/**
 * Marks an input this module parsed itself (a non-enumerable property, set before the input
 * is deep-frozen so it cannot change afterwards): the engine trusts these without parsing
 * them again. Spreading or copying an input does not copy the mark, so a changed copy is
 * validated again. (A WeakSet lookup cost more than the rest of the check.)
 */
const VALIDATED = Symbol('boardwright.sizing.validated');
type Marked = { [VALIDATED]?: true };

/** Freezes `value` and everything it holds. */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value as Record<string, unknown>)) deepFreeze(v);
  }
  return value;
}

function parseWith<T extends object>(schema: z.ZodType<T>, raw: unknown): T {
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    throw new SizingInputError(
      parsed.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message })),
    );
  }
  Object.defineProperty(parsed.data, VALIDATED, { value: true, enumerable: false });
  return deepFreeze(parsed.data);
}

/**
 * Validate one circuit's input with `circuitInputSchema` (defaults filled in). Throws a
 * SizingInputError naming the bad fields. The result is frozen and known to the engine, so
 * `sizeCircuit` does not parse it again.
 */
export function parseCircuitInput(raw: unknown): CircuitInput {
  return parseWith(circuitInputSchema as z.ZodType<CircuitInput>, raw);
}

/** Validate a board's input with `boardInputSchema`; as parseCircuitInput. */
export function parseBoardInput(raw: unknown): BoardInput {
  return parseWith(boardInputSchema as z.ZodType<BoardInput>, raw);
}

/**
 * A board this module validated, with another supply and some of its ways replaced (the supply
 * tree carries its values down and sets each sub-main's load): the same answer as
 * `parseBoardInput({ ...board, supply, ways })`, for less. Each way still the very object of
 * `board.ways` at its index was validated with the board and is frozen, so it is kept; the
 * supply and every other way are validated by their own schemas, and the board's own rules
 * (way ids unique, a circuit only on a protective device, no three-phase circuit on a
 * single-phase board) hold because each replaced way keeps its id, device and phases. Anything
 * else (a refusal, an unmarked board, a way that changed more) validates the whole board again,
 * so that a refusal names the fields exactly as `parseBoardInput` does.
 */
export function reviseBoardInput(board: BoardInput, supply: unknown, ways: readonly EngineWayInput[]): BoardInput {
  const whole = () => parseBoardInput({ ...board, supply, ways });
  if ((board as Marked)[VALIDATED] !== true || ways.length !== board.ways.length) return whole();
  const parsedSupply = supplySchema.safeParse(supply);
  if (!parsedSupply.success) return whole();
  const out: EngineWayInput[] = new Array(ways.length);
  for (let i = 0; i < ways.length; i++) {
    const was = board.ways[i];
    if (ways[i] === was) {
      out[i] = was;
      continue;
    }
    const way = waySchema.safeParse(ways[i]);
    if (
      !way.success ||
      way.data.id !== was.id ||
      ways[i].device !== was.device ||
      (way.data.circuit === null) !== (was.circuit === null) ||
      way.data.circuit?.phases !== was.circuit?.phases
    ) {
      return whole();
    }
    out[i] = way.data;
  }
  const revised = { ...board, supply: parsedSupply.data, ways: out };
  Object.defineProperty(revised, VALIDATED, { value: true, enumerable: false });
  return deepFreeze(revised);
}

/** The input itself if this module validated it, else the result of validating it (or a throw). */
export function validCircuitInput(input: unknown): CircuitInput {
  return (input as Marked | null)?.[VALIDATED] === true ? (input as CircuitInput) : parseCircuitInput(input);
}

/** As validCircuitInput, for a board. */
export function validBoardInput(input: unknown): BoardInput {
  return (input as Marked | null)?.[VALIDATED] === true ? (input as BoardInput) : parseBoardInput(input);
}
