import type { ButtonHTMLAttributes } from 'react';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';

const base =
  'inline-flex items-center justify-center gap-2 rounded-[3px] font-semibold leading-none whitespace-nowrap ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-reference text-white hover:bg-[color-mix(in_srgb,var(--color-reference)_86%,black)]',
  secondary: 'border border-rule-strong bg-sheet text-ink hover:bg-wash',
  quiet: 'text-reference hover:bg-wash',
  danger: 'bg-antibonding text-white hover:bg-[color-mix(in_srgb,var(--color-antibonding)_86%,black)]',
};

const sizes = {
  sm: 'h-8 px-3 text-sm',
  md: 'h-10 px-4 text-[0.95rem]',
} as const;

/** Class names of our button, for links and submit inputs that must look like one. */
export function buttonClasses(variant: ButtonVariant = 'secondary', size: keyof typeof sizes = 'md'): string {
  return `${base} ${variants[variant]} ${sizes[size]}`;
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: keyof typeof sizes;
}

export function Button({ variant = 'secondary', size = 'md', className = '', type = 'button', ...rest }: ButtonProps) {
  return <button type={type} className={`${buttonClasses(variant, size)} ${className}`} {...rest} />;
}
