import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-accent-700 text-white border-accent-700 hover:bg-accent-800 hover:border-accent-800',
  secondary: 'bg-white text-stone-800 border-stone-300 hover:bg-stone-50 hover:border-stone-400',
  danger: 'bg-white text-red-800 border-red-300 hover:bg-red-50 hover:border-red-400',
  quiet: 'bg-transparent text-accent-700 border-transparent hover:bg-accent-50',
};

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  /** True while the request this button started is running: disables it and says so. */
  busy?: boolean;
  busyLabel?: string;
  size?: 'md' | 'sm';
}

export function Button({ variant = 'primary', busy = false, busyLabel, size = 'md', className = '', children, disabled, type = 'button', ...rest }: ButtonProps) {
  const sizing = size === 'sm' ? 'px-3 py-1 text-sm' : 'px-4 py-2';
  return (
    <button
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex items-center justify-center gap-2 rounded-md border font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-55 ${sizing} ${VARIANTS[variant]} ${className}`}
      {...rest}
    >
      {busy && busyLabel ? busyLabel : children}
    </button>
  );
}
