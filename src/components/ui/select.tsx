import type { Ref, SelectHTMLAttributes } from 'react';
import { cn } from '@/lib/cn.js';
import { controlClasses } from './input.js';

export interface SelectOption {
  value: string;
  label: string;
  disabled?: boolean;
}

export interface SelectProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'children'> {
  options: readonly SelectOption[];
  ref?: Ref<HTMLSelectElement>;
}

/** A native select (keyboard and screen-reader behaviour for free) with our styling and chevron. */
export function Select({ options, className, ...rest }: SelectProps) {
  const invalid = rest['aria-invalid'] === true || rest['aria-invalid'] === 'true';
  return (
    <span className={cn('relative block', className)}>
      <select className={controlClasses(invalid, 'h-10 appearance-none pr-9')} {...rest}>
        {options.map((o) => (
          <option key={o.value} value={o.value} disabled={o.disabled}>
            {o.label}
          </option>
        ))}
      </select>
      <svg
        className="pointer-events-none absolute top-1/2 right-3 size-4 -translate-y-1/2 text-ink-600"
        viewBox="0 0 16 16"
        aria-hidden="true"
      >
        <path d="M4 6l4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
    </span>
  );
}
