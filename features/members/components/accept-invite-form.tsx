'use client';

import { CircleCheck } from 'lucide-react';
import Link from 'next/link';
import { useState } from 'react';
import { z } from 'zod';

import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import { ApiError } from '@/lib/api/client';
import { useServerForm } from '@/lib/forms/use-server-form';
import { passwordSchema } from '@/lib/members/schemas';

import { acceptInvitation } from '../api/members-api';

// The server's password rules, plus a second entry to catch a slip of the finger
const choosePasswordSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, {
    path: ['confirm'],
    message: 'The two passwords are not the same.',
  });
type ChoosePassword = z.infer<typeof choosePasswordSchema>;

/** Sets the new member's password and takes up the invitation. */
export function AcceptInviteForm({ token, email }: { token: string; email: string }) {
  const [done, setDone] = useState(false);
  const [closed, setClosed] = useState<string | null>(null);
  const {
    register,
    formError,
    onSubmit,
    formState: { errors, isSubmitting },
  } = useServerForm<ChoosePassword, ChoosePassword>({
    schema: choosePasswordSchema,
    defaultValues: { password: '', confirm: '' },
    fields: ['password'],
    submit: async ({ password }) => {
      try {
        await acceptInvitation(token, password);
        setDone(true);
      } catch (error) {
        // A used or expired link cannot be retried; say so plainly
        if (error instanceof ApiError && (error.status === 410 || error.status === 409)) {
          setClosed(error.message);
          return;
        }
        throw error;
      }
    },
  });

  if (done) {
    return (
      <div role="status" className="flex flex-col gap-4">
        <p className="flex items-start gap-2 text-sm text-ink">
          <CircleCheck aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-verdict-pass" />
          <span>
            Your account is ready. Sign in with <strong>{email}</strong> and the password you chose.
          </span>
        </p>
        <Link
          href="/login"
          className="inline-flex h-10 items-center justify-center rounded-md border border-ink bg-ink px-4 text-sm font-medium text-paper hover:bg-ink/90"
        >
          Go to sign in
        </Link>
      </div>
    );
  }

  if (closed) {
    return (
      <div className="flex flex-col gap-4">
        <FormAlert>{closed}</FormAlert>
        <Link href="/login" className="text-sm text-ink underline underline-offset-4">
          Go to sign in
        </Link>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {/* Lets password managers file the new password under the right account */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <Field
        label="Choose a password"
        hint="At least 10 characters, with a letter and a digit."
        error={errors.password?.message}
      >
        {(id, d) => (
          <Input
            id={id}
            type="password"
            autoComplete="new-password"
            aria-describedby={d}
            aria-invalid={errors.password ? true : undefined}
            {...register('password')}
          />
        )}
      </Field>
      <Field label="Type it again" error={errors.confirm?.message}>
        {(id, d) => (
          <Input
            id={id}
            type="password"
            autoComplete="new-password"
            aria-describedby={d}
            aria-invalid={errors.confirm ? true : undefined}
            {...register('confirm')}
          />
        )}
      </Field>
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Setting up…' : 'Set password and join'}
      </Button>
    </form>
  );
}
