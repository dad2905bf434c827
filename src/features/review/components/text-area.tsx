import type { TextareaHTMLAttributes } from 'react';
import { cn } from '@/lib/cn.js';
import { controlClasses } from '@/components/ui/input.js';

/** A multi-line control styled like the kit's inputs (the kit has no textarea of its own yet). */
export function TextArea({ className, rows = 4, ...rest }: TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const invalid = rest['aria-invalid'] === true || rest['aria-invalid'] === 'true';
  return <textarea rows={rows} className={controlClasses(invalid, cn('py-2 leading-relaxed', className))} {...rest} />;
}
