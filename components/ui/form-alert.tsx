import { CircleAlert } from 'lucide-react';

import { cn } from '@/lib/cn';

/** A form-level error (not tied to one field), read out when it appears. */
export function FormAlert({ children, className }: { children: React.ReactNode; className?: string }) {
  return (
    <p
      role="alert"
      className={cn(
        'flex items-start gap-2 rounded-md border border-verdict-fail/30 bg-verdict-fail-bg px-3 py-2 text-sm text-verdict-fail',
        className,
      )}
    >
      <CircleAlert aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
      <span>{children}</span>
    </p>
  );
}
