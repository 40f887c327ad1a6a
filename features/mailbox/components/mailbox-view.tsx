'use client';

import { RefreshCw } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { cn } from '@/lib/cn';

import { useMailbox } from '../api/use-mailbox';
import { CaughtMailList } from './caught-mail-list';
import { OutboxTable } from './outbox-table';

const DESCRIPTION =
  'For setting up and testing e-mail: every message the app queues for this organisation, ' +
  'with its delivery attempts, and what the local mail catcher has received.';

/** The development outbox (admins): what the app queued, and what the local catcher received. */
export function MailboxView() {
  const mailbox = useMailbox();
  return (
    <>
      <PageHeader
        title="Development outbox"
        description={DESCRIPTION}
        actions={
          <Button variant="secondary" onClick={() => void mailbox.refetch()} disabled={mailbox.isFetching}>
            <RefreshCw aria-hidden className={cn('h-4 w-4', mailbox.isFetching && 'animate-spin')} />
            Refresh
          </Button>
        }
      />
      {mailbox.isError ? (
        <ErrorState
          title="The outbox could not be loaded"
          message={mailbox.error.message}
          onRetry={() => void mailbox.refetch()}
          retrying={mailbox.isFetching}
        />
      ) : mailbox.isPending ? (
        <p role="status" className="text-sm text-ink-soft">
          Loading the outbox…
        </p>
      ) : (
        <div className="flex flex-col gap-8">
          <section aria-labelledby="outbox-heading" className="flex flex-col gap-3">
            <h2 id="outbox-heading" className="text-lg font-semibold text-ink">
              Outbox <span className="text-sm font-normal text-ink-soft">(latest 100)</span>
            </h2>
            <OutboxTable rows={mailbox.data.outbox} />
          </section>
          <section aria-labelledby="caught-heading" className="flex flex-col gap-3">
            <h2 id="caught-heading" className="text-lg font-semibold text-ink">
              Caught by the local mail catcher
            </h2>
            <p className="-mt-2 text-sm text-ink-soft">
              What the catcher on this machine received for this organisation’s recipients.
            </p>
            {mailbox.data.caught ? (
              <CaughtMailList messages={mailbox.data.caught} />
            ) : (
              <p className="text-sm text-ink-soft">
                No mail catcher is configured (MAIL_CATCHER_URL), or it did not answer. Messages still leave through the
                configured SMTP server.
              </p>
            )}
          </section>
          {mailbox.data.skipped ? (
            <p className="text-xs text-ink-faint">
              {mailbox.data.skipped} item(s) were not in the expected shape and are not shown.
            </p>
          ) : null}
        </div>
      )}
    </>
  );
}
