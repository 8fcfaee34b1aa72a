import type { ButtonHTMLAttributes, Ref } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';

const variants: Record<Variant, string> = {
  primary: 'bg-ink-800 text-white hover:bg-ink-900 disabled:bg-ink-400',
  secondary: 'bg-white text-ink-900 border border-line hover:bg-ink-50 disabled:opacity-50 disabled:hover:bg-white',
  danger: 'bg-danger text-white hover:brightness-95 disabled:opacity-60',
  ghost: 'bg-transparent text-ink-800 hover:bg-ink-50',
};

export const buttonClass = (variant: Variant = 'primary', extra = '') =>
  `inline-flex min-h-touch min-w-touch items-center justify-center gap-2 rounded-md px-4 text-base font-semibold transition-colors disabled:cursor-not-allowed ${variants[variant]} ${extra}`;

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  busy?: boolean;
  ref?: Ref<HTMLButtonElement>;
}

export function Button({
  variant = 'primary',
  busy = false,
  className = '',
  type = 'button',
  disabled,
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClass(variant, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? (
        <span
          aria-hidden="true"
          className="size-4 animate-spin rounded-full border-2 border-current border-r-transparent"
        />
      ) : null}
      {children}
    </button>
  );
}
