'use client';

import { signIn } from 'next-auth/react';
import { useState } from 'react';

import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';

/** E-mail and password; failures are explained without saying which of the two was wrong. */
export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    const result = await signIn('credentials', {
      email: String(form.get('email') ?? ''),
      password: String(form.get('password') ?? ''),
      redirect: false,
    });
    setPending(false);
    if (!result || result.error) {
      setError(
        result?.error && result.error !== 'CredentialsSignin'
          ? result.error
          : 'That e-mail and password do not match an active account.',
      );
      return;
    }
    window.location.assign(next);
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      <Field label="E-mail">
        {(id) => <Input id={id} name="email" type="email" autoComplete="username" required />}
      </Field>
      <Field label="Password">
        {(id) => <Input id={id} name="password" type="password" autoComplete="current-password" required />}
      </Field>
      {error ? (
        <p role="alert" className="rounded-md bg-verdict-fail-bg px-3 py-2 text-sm text-verdict-fail">
          {error}
        </p>
      ) : null}
      <Button type="submit" disabled={pending}>
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
