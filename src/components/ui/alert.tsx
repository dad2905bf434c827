import type { ReactNode } from 'react';
import { cn } from '@/lib/cn.js';

export type AlertTone = 'info' | 'success' | 'warning' | 'error';

const TONES: Record<AlertTone, { box: string; icon: string }> = {
  info: { box: 'border-mulberry-300 bg-mulberry-50 text-mulberry-900', icon: 'M8 7v4M8 5h.01' },
  success: { box: 'border-moss-700/40 bg-moss-50 text-moss-700', icon: 'M5 8.2l2 2 4-4.4' },
  warning: { box: 'border-ochre-800/40 bg-ochre-50 text-ochre-800', icon: 'M8 5v3.5M8 11h.01' },
  error: { box: 'border-vermilion-700/50 bg-vermilion-50 text-vermilion-800', icon: 'M5.5 5.5l5 5M10.5 5.5l-5 5' },
};

interface AlertProps {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
  /** Extra controls on the right (a retry button, a dismiss button). */
  action?: ReactNode;
}

/**
 * A message in the flow of the page. Errors and warnings are announced at once (role="alert");
 * information and success politely (role="status").
 */
export function Alert({ tone = 'info', title, children, className, action }: AlertProps) {
  const t = TONES[tone];
  return (
    <div
      role={tone === 'error' || tone === 'warning' ? 'alert' : 'status'}
      className={cn('flex items-start gap-3 rounded-md border px-4 py-3 text-sm', t.box, className)}
    >
      <svg className="mt-0.5 size-4 shrink-0" viewBox="0 0 16 16" aria-hidden="true">
        <circle cx="8" cy="8" r="7" fill="none" stroke="currentColor" strokeWidth="1.4" />
        <path d={t.icon} fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
      <div className="min-w-0 flex-1">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className={cn(title ? 'mt-0.5' : undefined)}>{children}</div>}
      </div>
      {action}
    </div>
  );
}
