import { RefreshCw, TriangleAlert } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';

type ErrorStateProps = {
  title?: string;
  message: string;
  onRetry?: () => void;
  retrying?: boolean;
  className?: string;
};

/** A load that failed: what went wrong, and a way to try again. */
export function ErrorState({
  title = 'This could not be loaded',
  message,
  onRetry,
  retrying,
  className,
}: ErrorStateProps) {
  return (
    <div
      role="alert"
      className={cn(
        'flex flex-col items-start gap-3 rounded-card border border-verdict-fail/30 bg-verdict-fail-bg px-5 py-4 sm:flex-row sm:items-center',
        className,
      )}
    >
      <TriangleAlert aria-hidden className="h-5 w-5 shrink-0 text-verdict-fail" />
      <div className="flex-1">
        <p className="text-sm font-semibold text-verdict-fail">{title}</p>
        <p className="text-sm text-ink">{message}</p>
      </div>
      {onRetry ? (
        <Button variant="secondary" size="sm" onClick={onRetry} disabled={retrying}>
          <RefreshCw aria-hidden className={cn('h-4 w-4', retrying && 'animate-spin')} />
          {retrying ? 'Trying…' : 'Try again'}
        </Button>
      ) : null}
    </div>
  );
}
