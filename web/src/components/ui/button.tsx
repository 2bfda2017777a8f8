import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';

const VARIANT_CLASSES: Record<Variant, string> = {
  primary: 'bg-ink text-paper hover:bg-ink/85 border border-ink',
  secondary: 'bg-panel text-ink border border-ink/40 hover:border-ink',
  danger: 'bg-panel text-diverged border border-diverged/60 hover:border-diverged',
  quiet: 'bg-transparent text-ink border border-transparent hover:border-rule',
};

/** The button look, also for links that act as the page's main step. */
export function buttonClasses(variant: Variant = 'secondary'): string {
  return `inline-flex items-center gap-1.5 rounded-sm px-3 py-1.5 text-sm font-medium focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-twin disabled:cursor-not-allowed disabled:opacity-50 ${VARIANT_CLASSES[variant]}`;
}

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant };

export function Button({ variant = 'secondary', className = '', type = 'button', ...rest }: ButtonProps) {
  return <button type={type} className={`${buttonClasses(variant)} ${className}`} {...rest} />;
}
