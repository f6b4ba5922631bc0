import type { ComponentPropsWithRef } from 'react';
import { Link, type LinkProps } from 'react-router';

export type ButtonVariant = 'primary' | 'secondary' | 'danger';

const base =
  'inline-flex min-h-11 items-center justify-center gap-2 border-[1.5px] px-4 py-2 font-condensed text-sm font-semibold tracking-label uppercase no-underline transition-colors disabled:cursor-not-allowed disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'border-ink bg-ink text-paper hover:bg-ink-2 hover:border-ink-2',
  secondary: 'border-ink bg-transparent text-ink hover:bg-paper-2',
  // For actions that remove something; always behind a confirmation.
  danger: 'border-oxide-2 bg-oxide-2 text-paper hover:bg-oxide hover:border-oxide',
};

/** Class list shared by buttons and links that look like buttons, so both stay in step. */
export function buttonClass(variant: ButtonVariant = 'primary', extra = ''): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

type ButtonProps = ComponentPropsWithRef<'button'> & { variant?: ButtonVariant };

export function Button({ variant = 'primary', className = '', type = 'button', ...rest }: ButtonProps) {
  // type="button" by default: a stray button inside a form should never submit it.
  return <button type={type} className={buttonClass(variant, className)} {...rest} />;
}

type ButtonLinkProps = LinkProps & { variant?: ButtonVariant };

export function ButtonLink({ variant = 'secondary', className = '', ...rest }: ButtonLinkProps) {
  return <Link className={buttonClass(variant, className)} {...rest} />;
}
