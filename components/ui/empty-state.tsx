import { cn } from '@/lib/cn';

type EmptyStateProps = {
  icon?: React.ReactNode;
  title: string;
  children?: React.ReactNode;
  action?: React.ReactNode;
  className?: string;
};

/** What a list shows before it has anything in it, with the next step when there is one. */
export function EmptyState({ icon, title, children, action, className }: EmptyStateProps) {
  return (
    <div
      className={cn(
        'flex flex-col items-center gap-3 rounded-card border border-dashed border-line-strong bg-paper-raised px-6 py-12 text-center',
        className,
      )}
    >
      {icon ? <div className="text-ink-faint">{icon}</div> : null}
      <h2 className="text-base font-semibold text-ink">{title}</h2>
      {children ? <div className="max-w-md text-sm text-ink-soft">{children}</div> : null}
      {action ? <div className="mt-2">{action}</div> : null}
    </div>
  );
}
