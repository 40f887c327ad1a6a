/**
 * Whether two plain JSON-like values are the same: objects compared key by key in any order
 * (a stored board's jsonb keeps keys in its own order), a key holding `undefined` counted as
 * absent (a form's empty optional field).
 */
export function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  const keys = (o: object) => Object.entries(o).filter(([, v]) => v !== undefined);
  const left = keys(a);
  const right = new Map(keys(b));
  return left.length === right.size && left.every(([k, v]) => right.has(k) && sameValue(v, right.get(k)));
}
