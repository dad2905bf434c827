import type { ReactNode } from 'react';
import { cn } from '@/lib/cn.js';

export type BadgeTone = 'neutral' | 'brand' | 'success' | 'danger' | 'warning' | 'highlight';

// Each pairing keeps the text at 4.5:1 or better on its tint.
const TONES: Record<BadgeTone, string> = {
  neutral: 'bg-ink-100 text-ink-800 ring-ink-600/20',
  brand: 'bg-mulberry-50 text-mulberry-800 ring-mulberry-700/20',
  success: 'bg-moss-50 text-moss-700 ring-moss-700/25',
  danger: 'bg-vermilion-50 text-vermilion-800 ring-vermilion-700/25',
  warning: 'bg-ochre-50 text-ochre-800 ring-ochre-800/25',
  highlight: 'bg-saffron-100 text-saffron-800 ring-saffron-800/25',
};

export function Badge({ tone = 'neutral', children, className }: { tone?: BadgeTone; children: ReactNode; className?: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center rounded-full px-2 py-0.5 text-xs font-medium whitespace-nowrap ring-1 ring-inset',
        TONES[tone],
        className,
      )}
    >
      {children}
    </span>
  );
}
