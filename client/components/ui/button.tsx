import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';
type Size = 'md' | 'sm';

const base =
  'inline-flex items-center justify-center gap-2 rounded-md font-semibold whitespace-nowrap transition-colors disabled:cursor-not-allowed disabled:opacity-55';

const variants: Record<Variant, string> = {
  // Ochre is reserved for the one primary action of a view.
  primary: 'bg-ochre text-ink shadow-[inset_0_-2px_0_rgb(0_0_0/0.12)] hover:bg-ochre-bright disabled:hover:bg-ochre',
  secondary: 'border border-rule-strong bg-paper-raised text-ink hover:border-ink-soft hover:bg-paper',
  quiet: 'text-ink-soft underline-offset-4 hover:text-ink hover:underline',
  danger: 'border border-rust/40 bg-paper-raised text-rust hover:border-rust hover:bg-rust-wash',
};

const sizes: Record<Size, string> = {
  md: 'h-10 px-4 text-[0.9375rem]',
  sm: 'h-8 px-3 text-sm',
};

export function buttonClasses(variant: Variant = 'secondary', size: Size = 'md', extra = ''): string {
  return [base, variants[variant], variant === 'quiet' ? 'h-auto px-0' : sizes[size], extra].join(' ');
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  /** Shows the label of the action in progress and blocks a second click. */
  busy?: boolean;
  busyLabel?: string;
}

export function Button({ variant = 'secondary', size = 'md', busy = false, busyLabel, className = '', type = 'button', children, disabled, ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClasses(variant, size, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...rest}>
      {busy ? (busyLabel ?? children) : children}
    </button>
  );
}
