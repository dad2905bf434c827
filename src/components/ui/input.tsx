import type { InputHTMLAttributes, Ref } from 'react';
import { cn } from '@/lib/cn.js';

export const controlClasses = (invalid?: boolean, className?: string) =>
  cn(
    'block w-full rounded-md border bg-surface px-3 text-sm text-ink-950 shadow-xs transition-colors',
    'placeholder:text-ink-500 disabled:bg-ink-100 disabled:text-ink-600',
    'focus:outline-none focus-visible:outline-2 focus-visible:outline-offset-0 focus-visible:outline-mulberry-600',
    invalid ? 'border-vermilion-700' : 'border-rule-strong hover:border-ink-500',
    className,
  );

export interface InputProps extends InputHTMLAttributes<HTMLInputElement> {
  ref?: Ref<HTMLInputElement>;
}

export function Input({ className, ...rest }: InputProps) {
  const invalid = rest['aria-invalid'] === true || rest['aria-invalid'] === 'true';
  return <input className={controlClasses(invalid, cn('h-10', className))} {...rest} />;
}
