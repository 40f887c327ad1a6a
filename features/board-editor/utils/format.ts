/** A number for display with a fixed count of decimals, or an en dash when unknown. */
export function fmt(value: number | null | undefined, decimals = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return value.toFixed(decimals);
}

/** A number with its unit, or an en dash. */
export function withUnit(value: number | null | undefined, unit: string, decimals = 2): string {
  const text = fmt(value, decimals);
  return text === '–' ? text : `${text} ${unit}`;
}
