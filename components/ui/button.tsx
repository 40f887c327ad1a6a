import { forwardRef } from 'react';

import { cn } from '@/lib/cn';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

const variants: Record<Variant, string> = {
  primary: 'bg-ink text-paper hover:bg-ink/90 border border-ink',
  secondary: 'bg-paper-raised text-ink border border-line-strong hover:bg-paper-sunk',
  quiet: 'bg-transparent text-ink-soft hover:text-ink hover:bg-paper-sunk border border-transparent',
  danger: 'bg-verdict-fail text-white border border-verdict-fail hover:bg-verdict-fail/90',
};

export type ButtonProps = React.ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: Variant;
  size?: 'sm' | 'md';
};

/** The one button of the app. */
export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant = 'primary', size = 'md', className, type = 'button', ...props },
  ref,
) {
  return (
    <button
      ref={ref}
      type={type}
      className={cn(
        'inline-flex items-center justify-center gap-1.5 rounded-md font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50',
        size === 'sm' ? 'h-8 px-3 text-sm' : 'h-10 px-4 text-sm',
        variants[variant],
        className,
      )}
      {...props}
    />
  );
});
