import { CircleAlert, CircleCheck, Clock } from 'lucide-react';

import { When } from '@/components/ui/when';
import { cn } from '@/lib/cn';

import type { OutboxRow } from '../types/mailbox';

const th = 'h-11 px-4 text-left text-xs font-semibold tracking-wide whitespace-nowrap text-ink-soft uppercase';
const td = 'px-4 py-3 align-top text-sm text-ink';

const statusLook = {
  queued: { word: 'Waiting', icon: Clock, tone: 'text-verdict-near' },
  sent: { word: 'Sent', icon: CircleCheck, tone: 'text-verdict-pass' },
  failed: { word: 'Gave up', icon: CircleAlert, tone: 'text-verdict-fail' },
} as const;

/** Every message the app has queued: where it went, whether it left, and why not. */
export function OutboxTable({ rows }: { rows: OutboxRow[] }) {
  if (!rows.length) {
    return <p className="text-sm text-ink-soft">Nothing has been queued yet.</p>;
  }
  return (
    <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
      <table className="w-full border-collapse">
        <caption className="sr-only">Outbox</caption>
        <thead className="bg-paper-sunk/60">
          <tr className="border-b border-line">
            <th scope="col" className={th}>
              Queued
            </th>
            <th scope="col" className={th}>
              To
            </th>
            <th scope="col" className={th}>
              Subject
            </th>
            <th scope="col" className={th}>
              Status
            </th>
            <th scope="col" className={cn(th, 'text-right')}>
              Attempts
            </th>
            <th scope="col" className={th}>
              Last error
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => {
            const look = statusLook[row.status];
            const Icon = look.icon;
            return (
              <tr key={row.id} className="border-b border-line last:border-0">
                <td className={cn(td, 'whitespace-nowrap text-ink-soft')}>
                  <When iso={row.createdAt} />
                </td>
                <td className={td}>{row.toAddress}</td>
                <td className={td}>{row.subject}</td>
                <td className={cn(td, 'whitespace-nowrap')}>
                  <span className={cn('inline-flex items-center gap-1.5 font-medium', look.tone)}>
                    <Icon aria-hidden className="h-4 w-4" />
                    {look.word}
                  </span>
                  {row.sentAt ? (
                    <span className="block text-xs text-ink-faint">
                      <When iso={row.sentAt} />
                    </span>
                  ) : null}
                </td>
                <td className={cn(td, 'text-right tabular-nums')}>{row.attempts}</td>
                <td className={cn(td, 'max-w-[24rem] text-xs text-ink-soft')}>
                  {row.lastError ? (
                    <span className="line-clamp-3 break-words font-mono">{row.lastError}</span>
                  ) : (
                    <span className="text-ink-faint">—</span>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
