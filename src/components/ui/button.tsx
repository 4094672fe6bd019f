import type { ButtonHTMLAttributes } from 'react';

const variants = {
  primary: 'bg-brass-400 text-hull-950 hover:bg-brass-300 disabled:bg-brass-200',
  secondary: 'border border-hull-300 bg-white text-hull-800 hover:bg-hull-50 disabled:text-hull-400',
  danger: 'bg-signal-600 text-white hover:bg-signal-700 disabled:bg-signal-100',
  quiet: 'text-hull-700 hover:bg-hull-100 disabled:text-hull-300',
} as const;

const sizes = {
  md: 'px-4 py-2 text-body',
  sm: 'px-2.5 py-1 text-small',
} as const;

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: keyof typeof variants;
  size?: keyof typeof sizes;
  /** Shows a busy label and blocks a second click while a request runs. */
  pending?: boolean;
  pendingLabel?: string;
}

export function Button({ variant = 'primary', size = 'md', pending = false, pendingLabel, className = '', disabled, children, type = 'button', ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={`inline-flex items-center justify-center gap-2 rounded-plate font-semibold transition-colors disabled:cursor-not-allowed ${variants[variant]} ${sizes[size]} ${className}`}
      {...rest}
    >
      {pending ? (pendingLabel ?? 'Working…') : children}
    </button>
  );
}
