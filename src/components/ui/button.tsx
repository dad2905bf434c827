import type { ButtonHTMLAttributes } from 'react';
import { cn } from '@/lib/cn.js';
import { Spinner } from './spinner.js';

export type ButtonVariant = 'primary' | 'secondary' | 'ghost' | 'danger';
export type ButtonSize = 'sm' | 'md';

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-mulberry-700 text-white hover:bg-mulberry-800 active:bg-mulberry-900 shadow-sm',
  secondary: 'bg-surface text-ink-950 border border-rule-strong hover:bg-mulberry-50 hover:border-mulberry-300',
  ghost: 'text-mulberry-700 hover:bg-mulberry-50',
  danger: 'bg-surface text-vermilion-700 border border-vermilion-700/40 hover:bg-vermilion-50',
};
const SIZES: Record<ButtonSize, string> = {
  sm: 'h-8 px-3 text-sm gap-1.5',
  md: 'h-10 px-4 text-sm gap-2',
};

export const buttonClasses = (variant: ButtonVariant = 'primary', size: ButtonSize = 'md', className?: string) =>
  cn(
    'inline-flex items-center justify-center rounded-md font-medium whitespace-nowrap transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-55',
    VARIANTS[variant],
    SIZES[size],
    className,
  );

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner and blocks further clicks while a request is in flight. */
  loading?: boolean;
}

export function Button({ variant, size, loading, disabled, className, children, type = 'button', ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || loading}
      aria-busy={loading || undefined}
      {...rest}
    >
      {loading && <Spinner />}
      {children}
    </button>
  );
}
