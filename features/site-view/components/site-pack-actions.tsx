'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { FileDown, FileText } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';

import { PdfMailForm } from '@/components/ui/pdf-mail-form';
import { errorMessage } from '@/lib/api/client';
import { sitePackEmailSchema, type SitePackEmailInput } from '@/lib/sites/tree-types';

import { postSitePackEmail } from '../api/site-tree-api';

const linkClass =
  'inline-flex h-10 items-center gap-1.5 rounded-md border border-line-strong bg-paper-raised px-4 text-sm font-medium hover:bg-paper-sunk';

/**
 * The site pack (the single-line diagram, the values carried to each board with their working,
 * then every board's schedule, one PDF): open it, download it, or e-mail it through the outbox.
 * For the members who may print drafts (the server checks again).
 */
export function SitePackActions({ siteId }: { siteId: string }) {
  const form = useForm<SitePackEmailInput>({
    resolver: zodResolver(sitePackEmailSchema),
    defaultValues: { to: '', message: '' },
  });
  const send = useMutation({
    mutationFn: (input: SitePackEmailInput) =>
      postSitePackEmail(siteId, { ...input, message: input.message || undefined }),
    onSuccess: (r) => {
      toast.success(`Site pack queued for ${r.mail.to}.`);
      form.reset({ to: '', message: '' });
    },
  });
  const pack = `/api/sites/${encodeURIComponent(siteId)}/pack`;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-2">
        <a href={pack} target="_blank" rel="noopener" className={linkClass}>
          <FileText aria-hidden className="h-4 w-4" /> Site pack (PDF)
        </a>
        <a href={`${pack}?download=1`} className={linkClass}>
          <FileDown aria-hidden className="h-4 w-4" /> Download the site pack
        </a>
      </div>
      <PdfMailForm
        title="E-mail the site pack"
        to={form.register('to')}
        message={form.register('message')}
        errors={{ to: form.formState.errors.to?.message, message: form.formState.errors.message?.message }}
        pending={send.isPending}
        submitLabel="Send the pack"
        onSubmit={form.handleSubmit((v) => send.mutate(v))}
        failure={send.isError ? errorMessage(send.error) : null}
      />
    </div>
  );
}
