'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type DefaultValues, type FieldPath, type FieldValues, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';

import { applyServerIssues } from './server-issues';
import { formErrorMap } from './zod-messages';

/**
 * A form checked by a zod schema in the browser (with our messages) and then by the API:
 * `submit` runs on valid input, and when it throws, the API's field issues go beside their
 * fields and anything else becomes `formError`, shown above the buttons.
 */
export function useServerForm<Values extends FieldValues, Output extends FieldValues>({
  schema,
  defaultValues,
  fields,
  submit,
}: {
  schema: z.ZodType<Output, Values>;
  defaultValues: DefaultValues<Values>;
  /** The fields that an API issue may be put on. */
  fields: readonly FieldPath<Values>[];
  submit: (input: Output, form: UseFormReturn<Values, unknown, Output>) => Promise<void>;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(schema, { error: formErrorMap }),
    defaultValues,
  });
  const onSubmit = form.handleSubmit(async (input) => {
    setFormError(null);
    try {
      await submit(input, form);
    } catch (error) {
      setFormError(applyServerIssues(error, form.setError, fields));
    }
  });
  return { ...form, formError, onSubmit };
}
