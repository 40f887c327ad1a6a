'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { FileDown, Printer, Tags } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { PdfMailForm } from '@/components/ui/pdf-mail-form';
import { errorMessage } from '@/lib/api/client';
import { MAIL_STATUS_NAMES } from '@/lib/names';

import { fetchScheduleMails, postScheduleEmail, scheduleMailsKey } from '../api/schedule-api';
import { scheduleEmailSchema, type ScheduleEmailInput } from '../types/schemas';

type Props = {
  boardId: string;
  revision: number;
  /** The revisions that may be printed, newest first, with how to name them. */
  choices: { revision: number; label: string }[];
};

const STATUS_WORDS = MAIL_STATUS_NAMES;

/** Print, download, label strips, revision choice and e-mailing, above the schedule; hidden in print. */
export function ScheduleToolbar({ boardId, revision, choices }: Props) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const query = `?revision=${revision}`;
  const mails = useQuery({
    queryKey: scheduleMailsKey(boardId),
    queryFn: () => fetchScheduleMails(boardId),
    refetchInterval: 5_000,
  });
  const form = useForm<ScheduleEmailInput>({
    resolver: zodResolver(scheduleEmailSchema),
    defaultValues: { to: '', message: '' },
  });
  const send = useMutation({
    mutationFn: (input: ScheduleEmailInput) =>
      postScheduleEmail(boardId, { ...input, revision, message: input.message || undefined }),
    onSuccess: (r) => {
      toast.success(`Schedule queued for ${r.mail.to}.`);
      form.reset({ to: '', message: '' });
      void queryClient.invalidateQueries({ queryKey: scheduleMailsKey(boardId) });
    },
  });
  const base = `/api/boards/${boardId}`;
  return (
    <div className="space-y-4 print:hidden">
      <div className="flex flex-wrap items-end gap-2">
        <Button onClick={() => window.print()}>
          <Printer aria-hidden className="h-4 w-4" /> Print
        </Button>
        <a
          href={`${base}/schedule${query}&download=1`}
          className="inline-flex h-10 items-center gap-1.5 rounded-md border border-line-strong bg-paper-raised px-4 text-sm font-medium hover:bg-paper-sunk"
        >
          <FileDown aria-hidden className="h-4 w-4" /> Download PDF
        </a>
        <a
          href={`${base}/labels${query}`}
          className="inline-flex h-10 items-center gap-1.5 rounded-md border border-line-strong bg-paper-raised px-4 text-sm font-medium hover:bg-paper-sunk"
        >
          <Tags aria-hidden className="h-4 w-4" /> Label strips (PDF)
        </a>
        {choices.length > 1 ? (
          <label className="ml-auto flex items-center gap-2 text-sm">
            Revision
            <Select
              className="w-56"
              value={String(revision)}
              onChange={(e) => router.push(`/boards/${boardId}/schedule?revision=${e.target.value}`)}
            >
              {choices.map((c) => (
                <option key={c.revision} value={c.revision}>
                  {c.label}
                </option>
              ))}
            </Select>
          </label>
        ) : null}
      </div>
      <PdfMailForm
        title="E-mail this schedule"
        to={form.register('to')}
        message={form.register('message')}
        errors={{ to: form.formState.errors.to?.message, message: form.formState.errors.message?.message }}
        pending={send.isPending}
        submitLabel="Send PDF"
        onSubmit={form.handleSubmit((v) => send.mutate(v))}
        failure={send.isError ? errorMessage(send.error) : null}
      >
        {mails.data?.length ? (
          <table className="mt-4 w-full text-left text-sm">
            <caption className="mb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
              Sent from here
            </caption>
            <thead className="text-xs text-ink-soft">
              <tr>
                <th className="py-1">To</th>
                <th className="py-1">Revision</th>
                <th className="py-1">By</th>
                <th className="py-1">Status</th>
              </tr>
            </thead>
            <tbody>
              {mails.data.map((m) => (
                <tr key={m.id} className="border-t border-line">
                  <td className="py-1">{m.to}</td>
                  <td className="py-1">{m.revision}</td>
                  <td className="py-1">{m.sentByName}</td>
                  <td className="py-1" title={m.lastError ?? undefined}>
                    {STATUS_WORDS[m.status]}
                    {m.attempts > 1 ? ` (${m.attempts} attempts)` : ''}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
      </PdfMailForm>
    </div>
  );
}
