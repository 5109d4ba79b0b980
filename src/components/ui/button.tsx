import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { Link, type LinkProps } from 'react-router-dom';

type Tone = 'primary' | 'secondary' | 'quiet' | 'danger' | 'danger-outline';

const base =
  'inline-flex items-center justify-center gap-2 whitespace-nowrap rounded-plate px-4 py-2 text-small font-semibold transition-colors ' +
  'disabled:cursor-not-allowed disabled:opacity-60';

const tones: Record<Tone, string> = {
  primary: 'bg-tide-700 text-white hover:bg-tide-800 shadow-sm',
  secondary: 'border border-tide-700 bg-paper-raised text-tide-800 hover:bg-tide-50',
  quiet: 'text-tide-800 hover:bg-tide-50 underline-offset-4 hover:underline',
  danger: 'bg-signal-error text-white hover:bg-[#861e23]',
  'danger-outline': 'border border-signal-error/70 bg-paper-raised text-signal-error hover:bg-signal-error-bg',
};

export function buttonClass(tone: Tone = 'primary', extra = ''): string {
  return `${base} ${tones[tone]} ${extra}`.trim();
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  tone?: Tone;
  busy?: boolean;
  children: ReactNode;
}

export function Button({ tone = 'primary', busy = false, className = '', type = 'button', disabled, children, ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClass(tone, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...rest}>
      {busy ? <span aria-hidden="true" className="size-3 animate-spin rounded-full border-2 border-current border-r-transparent" /> : null}
      {children}
    </button>
  );
}

export function LinkButton({ tone = 'primary', className = '', ...rest }: LinkProps & { tone?: Tone }) {
  return <Link className={buttonClass(tone, className)} {...rest} />;
}
