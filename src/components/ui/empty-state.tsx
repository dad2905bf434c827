import type { ReactNode } from 'react';
import { cn } from '@/lib/cn.js';

interface EmptyStateProps {
  title: ReactNode;
  description?: ReactNode;
  action?: ReactNode;
  /** Replaces the default drawing (a blank graticule with one indicatrix). */
  icon?: ReactNode;
  className?: string;
}

export function EmptyState({ title, description, action, icon, className }: EmptyStateProps) {
  return (
    <div className={cn('flex flex-col items-center px-6 py-12 text-center', className)}>
      <div className="mb-4 text-mulberry-700">{icon ?? <BlankGraticule />}</div>
      <h3 className="text-base font-semibold text-ink-950">{title}</h3>
      {description && <div className="mt-1 max-w-md text-sm text-ink-600">{description}</div>}
      {action && <div className="mt-5">{action}</div>}
    </div>
  );
}

function BlankGraticule() {
  return (
    <svg className="h-16 w-24" viewBox="0 0 96 64" fill="none" aria-hidden="true">
      <g stroke="currentColor" strokeOpacity=".28" strokeWidth="1.4">
        <path d="M6 16 Q48 4 90 16M4 32 Q48 19 92 32M6 48 Q48 34 90 48" />
        <path d="M22 6 L16 60M48 4 V60M74 6 L80 60" />
      </g>
      <ellipse cx="48" cy="32" rx="17" ry="8" transform="rotate(-18 48 32)" fill="var(--color-saffron-300)" />
      <circle cx="48" cy="32" r="11.7" stroke="currentColor" strokeWidth="1.4" strokeDasharray="3 3" />
    </svg>
  );
}
