'use client';

import type { FormEventHandler } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { Button } from './button';
import { Field, Input } from './field';

type PdfMailFormProps = {
  /** The `to` and `message` fields as the caller's form registers them. */
  to: UseFormRegisterReturn;
  message: UseFormRegisterReturn;
  errors: { to?: string; message?: string };
  pending: boolean;
  submitLabel: string;
  onSubmit: FormEventHandler<HTMLFormElement>;
};

/** The form that sends a PDF (a schedule, a site pack) to an address, with an optional message. */
export function PdfMailForm({ to, message, errors, pending, submitLabel, onSubmit }: PdfMailFormProps) {
  return (
    <form className="mt-3 grid gap-3 md:grid-cols-[1fr_2fr_auto] md:items-end" noValidate onSubmit={onSubmit}>
      <Field label="To" error={errors.to}>
        {(id, describedBy) => (
          <Input id={id} type="email" aria-describedby={describedBy} aria-invalid={!!errors.to} {...to} />
        )}
      </Field>
      <Field label="Message (optional)" error={errors.message}>
        {(id, describedBy) => <Input id={id} aria-describedby={describedBy} {...message} />}
      </Field>
      <Button type="submit" disabled={pending}>
        {pending ? 'Sending…' : submitLabel}
      </Button>
    </form>
  );
}
