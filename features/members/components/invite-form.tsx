'use client';

import { UserPlus } from 'lucide-react';
import { toast } from 'sonner';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import { useServerForm } from '@/lib/forms/use-server-form';
import { inviteInputSchema, type InviteInput } from '@/lib/members/schemas';

import { useInviteMember } from '../api/use-members';
import { ROLE_CHOICES } from '../utils/roles';

type InviteValues = z.input<typeof inviteInputSchema>;

/** Invites someone by e-mail with a role; the e-mail carries a one-time link. */
export function InviteForm() {
  const invite = useInviteMember();
  const {
    register,
    watch,
    formError,
    onSubmit,
    formState: { errors, isSubmitting },
  } = useServerForm<InviteValues, InviteInput>({
    schema: inviteInputSchema,
    defaultValues: { email: '', name: '', role: 'designer' },
    fields: ['email', 'name', 'role'],
    submit: async (input, form) => {
      await invite.mutateAsync(input);
      toast.success(`Invitation queued for ${input.email}.`);
      form.reset({ email: '', name: '', role: input.role });
    },
  });
  const role = watch('role');

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-labelledby="invite-heading"
      className="rounded-card border border-line bg-paper-raised p-5"
    >
      <h2 id="invite-heading" className="text-base font-semibold text-ink">
        Invite someone
      </h2>
      <p className="mt-1 mb-4 text-sm text-ink-soft">
        They get an e-mail with a link to choose a password. The link works once and expires after seven days.
      </p>
      <div className="grid gap-4 md:grid-cols-[1fr_1fr_12rem_auto] md:items-start">
        <Field label="E-mail" error={errors.email?.message}>
          {(id, d) => (
            <Input
              id={id}
              type="email"
              autoComplete="off"
              aria-describedby={d}
              aria-invalid={errors.email ? true : undefined}
              {...register('email')}
            />
          )}
        </Field>
        <Field label="Name" error={errors.name?.message}>
          {(id, d) => (
            <Input
              id={id}
              autoComplete="off"
              aria-describedby={d}
              aria-invalid={errors.name ? true : undefined}
              {...register('name')}
            />
          )}
        </Field>
        <Field label="Role" error={errors.role?.message} hint={ROLE_CHOICES.find((r) => r.value === role)?.does}>
          {(id, d) => (
            <Select id={id} aria-describedby={d} aria-invalid={errors.role ? true : undefined} {...register('role')}>
              {ROLE_CHOICES.map((r) => (
                <option key={r.value} value={r.value}>
                  {r.label}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Button type="submit" disabled={isSubmitting} className="md:mt-6">
          <UserPlus aria-hidden className="h-4 w-4" />
          {isSubmitting ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
      {formError ? <FormAlert className="mt-4">{formError}</FormAlert> : null}
    </form>
  );
}
