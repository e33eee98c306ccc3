import { forwardRef, type ButtonHTMLAttributes } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cn } from './cn';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger' | 'accent';
type Size = 'md' | 'lg' | 'sm';

const base =
  'inline-flex items-center justify-center gap-2 rounded-xl font-bold no-underline transition-colors disabled:opacity-60 disabled:cursor-not-allowed min-h-11';
const variants: Record<Variant, string> = {
  primary: 'bg-heather-700 text-white hover:bg-heather-800 hover:text-white shadow-sm',
  secondary: 'bg-white text-heather-800 border-2 border-heather-300 hover:bg-heather-50 hover:text-heather-800',
  quiet: 'bg-transparent text-heather-800 hover:bg-heather-50 hover:text-heather-800',
  danger: 'bg-brick-700 text-white hover:bg-brick-500 hover:text-white',
  /** Marigold with dark text, for the one call to action on a dark panel. */
  accent: 'bg-marigold-400 text-ink hover:bg-marigold-300 hover:text-ink shadow-sm',
};
const sizes: Record<Size, string> = { sm: 'px-3 py-1.5 text-sm min-h-9', md: 'px-4 py-2', lg: 'px-6 py-3 text-lg' };

export function buttonClass(variant: Variant = 'primary', size: Size = 'md', extra?: string) {
  return cn(base, variants[variant], sizes[size], extra);
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  busy?: boolean;
}

export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant = 'primary', size = 'md', busy, className, children, disabled, type = 'button', ...rest },
  ref,
) {
  return (
    <button ref={ref} type={type} className={buttonClass(variant, size, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...rest}>
      {busy && <span className="size-4 animate-spin rounded-full border-2 border-current border-t-transparent" aria-hidden />}
      {children}
    </button>
  );
});

export function ButtonLink({ variant = 'primary', size = 'md', className, ...rest }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link className={buttonClass(variant, size, className)} {...rest} />;
}
