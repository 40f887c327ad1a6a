'use client';

import { useEffect, useState } from 'react';
import type { FieldValues, UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';

/**
 * What was typed into a way's form but is not valid yet, by form and way, for the life of the
 * tab: with the draft value it was typed over, so that an undo made meanwhile wins.
 */
const unfinished = new Map<string, { values: unknown; base: string }>();

/** The unfinished input kept for this form, if it was typed over exactly this value. */
export function useUnfinishedInput<T>(key: string, current: unknown): T | undefined {
  // Read once, on mount: later renders must not swap the form's defaults
  const [kept] = useState(() => {
    const entry = unfinished.get(key);
    return entry && entry.base === JSON.stringify(current) ? (entry.values as T) : undefined;
  });
  return kept;
}

/** Drops the kept input of a form (its value was changed from elsewhere). */
export function forgetUnfinishedInput(key: string): void {
  unfinished.delete(key);
}

/**
 * Keeps a form's not-yet-valid input when the form goes away (another way is selected), and
 * shows it again with its errors when the way comes back: nothing typed is lost.
 */
export function useKeepUnfinishedInput<T extends FieldValues>(
  key: string,
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  form: UseFormReturn<T, any, any>,
  schema: z.ZodType,
  current: unknown,
  restored: boolean,
): void {
  const base = JSON.stringify(current);
  useEffect(() => {
    if (restored) void form.trigger();
    // restored is fixed for the form's life; trigger once when it came back with errors
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  useEffect(
    () => () => {
      const values = form.getValues();
      if (schema.safeParse(values).success) unfinished.delete(key);
      else unfinished.set(key, { values, base });
    },
    [key, form, schema, base],
  );
}
