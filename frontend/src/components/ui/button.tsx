import type { ComponentProps } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-ink-900 text-paper-50 hover:bg-ink-700 border-ink-900',
  secondary: 'bg-paper-50 text-ink-900 hover:bg-paper-200 border-paper-300',
  quiet: 'bg-transparent text-ink-700 hover:bg-paper-200 border-transparent',
  danger: 'bg-paper-50 text-danger-700 hover:bg-danger-100 border-danger-600/40',
};

export const buttonClass = (variant: Variant = 'primary', size: 'sm' | 'md' = 'md') =>
  [
    'inline-flex items-center justify-center gap-1.5 rounded-control border font-medium transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-55',
    size === 'sm' ? 'px-2 py-0.5 text-sm' : 'px-3.5 py-1.5 text-base',
    VARIANTS[variant],
  ].join(' ');

type ButtonProps = ComponentProps<'button'> & {
  variant?: Variant;
  size?: 'sm' | 'md';
  /** Shown instead of the children while a request is in flight; the button is disabled meanwhile. */
  pendingLabel?: string;
  pending?: boolean;
};

export function Button({ variant, size, pending, pendingLabel, className, children, type, disabled, ...rest }: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={`${buttonClass(variant, size)} ${className ?? ''}`}
      {...rest}
    >
      {pending && pendingLabel ? pendingLabel : children}
    </button>
  );
}
