import { Paperclip } from 'lucide-react';

import { When } from '@/components/ui/when';

import type { CaughtMessage } from '../types/mailbox';

const PREVIEW_CHARS = 280;

/** The messages the local mail catcher received, newest first, each opening to its full text. */
export function CaughtMailList({ messages }: { messages: CaughtMessage[] }) {
  if (!messages.length) {
    return <p className="text-sm text-ink-soft">The mail catcher has not received anything yet.</p>;
  }
  return (
    <ul className="flex flex-col gap-3">
      {messages.map((m) => {
        const long = m.text.length > PREVIEW_CHARS;
        const preview = long ? `${m.text.slice(0, PREVIEW_CHARS)}…` : m.text;
        return (
          <li key={m.id} className="rounded-card border border-line bg-paper-raised px-4 py-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <p className="font-medium text-ink">{m.subject || '(no subject)'}</p>
              <p className="text-xs text-ink-faint">
                <When iso={m.receivedAt} />
              </p>
            </div>
            <p className="mt-0.5 text-sm text-ink-soft">
              To {m.to.join(', ') || '(nobody)'}
              {m.from ? ` · from ${m.from}` : ''}
            </p>
            {m.attachments.length ? (
              <p className="mt-1 flex items-center gap-1 text-xs text-ink-soft">
                <Paperclip aria-hidden className="h-3.5 w-3.5" />
                {m.attachments.map((a) => a.filename || a.contentType).join(', ')}
              </p>
            ) : null}
            <details className="mt-2 group">
              <summary className="cursor-pointer list-none text-sm whitespace-pre-wrap text-ink group-open:hidden">
                {preview || '(empty body)'}
                {long ? <span className="ml-1 text-copper-dark underline underline-offset-4">Show all</span> : null}
              </summary>
              <pre className="font-sans text-sm whitespace-pre-wrap break-words text-ink">{m.text}</pre>
            </details>
          </li>
        );
      })}
    </ul>
  );
}
