/** Reads a number input: empty stays empty (so the schema can say so), the rest is a number. */
export function numberOrEmpty(value: unknown): number | undefined {
  if (value === '' || value === null || value === undefined) return undefined;
  return typeof value === 'number' ? value : Number(value);
}
