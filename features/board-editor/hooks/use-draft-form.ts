'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef } from 'react';
import { useForm, type DefaultValues, type FieldValues } from 'react-hook-form';
import type { z } from 'zod';

import { formErrorMap } from '@/lib/forms/zod-messages';

import { useBoardDraftStore } from '../stores/board-draft-store';

/**
 * The app's plain-words messages, with strict bounds said as such ("more than 0", not "0 or
 * more") for the engine's `gt` and `lt` limits.
 */
const editorErrorMap: z.core.$ZodErrorMap = (issue) => {
  if (issue.code === 'too_small' && issue.origin === 'number' && issue.inclusive === false) {
    return `Use more than ${String(issue.minimum)}.`;
  }
  if (issue.code === 'too_big' && issue.origin === 'number' && issue.inclusive === false) {
    return `Use less than ${String(issue.maximum)}.`;
  }
  return formErrorMap(issue);
};

/**
 * A way's form as a view over the draft store. The fields show the draft's value, or the input
 * kept in the store while it is not valid yet (it survives selecting another way; an undo of
 * that way drops it). Each valid state of the fields is written to the draft (the store makes
 * nothing of a value it already holds, so the reset that follows an undo or redo is no edit),
 * each invalid one is kept as unfinished input. A change from elsewhere resets the fields.
 */
export function useDraftForm<Input extends FieldValues, Value extends object>(
  key: `${'circuit' | 'device'}:${string}`,
  schema: z.ZodType<Value, Input>,
  value: Value,
  write: (value: Value, field: string) => void,
) {
  const kept = useRef(useBoardDraftStore.getState().unfinished[key] as Input | undefined);
  const form = useForm<Input, unknown, Value>({
    resolver: zodResolver(schema as never, { error: editorErrorMap }) as never,
    mode: 'onChange',
    defaultValues: (kept.current ?? value) as DefaultValues<Input>,
  });
  // The draft value the fields stand for: a new one from the store means a change made elsewhere
  const shown = useRef(value);

  useEffect(() => {
    // Input kept from an earlier visit comes back with its errors
    if (kept.current) void form.trigger();
  }, [form]);

  useEffect(() => {
    if (value === shown.current) return;
    shown.current = value;
    form.reset(value as DefaultValues<Input>);
  }, [value, form]);

  const writeRef = useRef(write);
  writeRef.current = write;
  useEffect(() => {
    const subscription = form.watch((values, { name }) => {
      const parsed = schema.safeParse(values);
      if (!parsed.success) {
        useBoardDraftStore.getState().keepUnfinished(key, structuredClone(values));
        return;
      }
      shown.current = parsed.data;
      writeRef.current(parsed.data, name ?? key);
    });
    return () => subscription.unsubscribe();
  }, [form, schema, key]);

  return form;
}
