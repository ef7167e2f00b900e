// Buttons of the office console. Desk screens are dense, but a button still needs a target a
// tired hand hits first time (40 px high).
import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-brand text-white hover:bg-brand-dark border border-brand',
  secondary: 'bg-white text-ink border border-ink/50 hover:bg-ink/5',
  danger: 'bg-white text-sev-now border-2 border-sev-now hover:bg-sev-now/5',
  quiet: 'bg-transparent text-brand underline underline-offset-2 hover:text-brand-dark border border-transparent',
};

export function Button({ variant = 'secondary', className, ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      {...props}
      className={`inline-flex min-h-10 items-center justify-center gap-2 rounded px-3 font-bold disabled:cursor-not-allowed disabled:opacity-50 ${VARIANTS[variant]} ${className ?? ''}`}
    />
  );
}

export const linkButtonClass =
  'inline-flex min-h-10 items-center justify-center gap-2 rounded border border-brand bg-brand px-3 font-bold text-white hover:bg-brand-dark';
