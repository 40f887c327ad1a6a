'use client';

import { Mail } from 'lucide-react';
import type { FormEventHandler } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { Button } from './button';
import { Field, Input } from './field';
import { FormAlert } from './form-alert';

type PdfMailFormProps = {
  /** The folded section's heading ("E-mail this schedule"). */
  title: string;
  /** The `to` and `message` fields as the caller's form registers them. */
  to: UseFormRegisterReturn;
  message: UseFormRegisterReturn;
  errors: { to?: string; message?: string };
  pending: boolean;
  submitLabel: string;
  onSubmit: FormEventHandler<HTMLFormElement>;
  /** Why the last send failed, in words, or null. */
  failure: string | null;
  /** Shown below the form (the schedule's list of sent mails). */
  children?: React.ReactNode;
};

/**
 * A folded section with the form that sends a PDF (a schedule, a site pack) to an address, with
 * an optional message, and why the last send failed.
 */
export function PdfMailForm({
  title,
  to,
  message,
  errors,
  pending,
  submitLabel,
  onSubmit,
  failure,
  children,
}: PdfMailFormProps) {
  return (
    <details className="rounded-card border border-line bg-paper-raised p-4">
      <summary className="flex cursor-pointer items-center gap-2 text-sm font-semibold">
        <Mail aria-hidden className="h-4 w-4" /> {title}
      </summary>
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
      {failure ? <FormAlert className="mt-3">{failure}</FormAlert> : null}
      {children}
    </details>
  );
}
