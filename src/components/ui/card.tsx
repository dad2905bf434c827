import type { HTMLAttributes, ReactNode } from 'react';
import { cn } from '@/lib/cn.js';

export function Card({ className, ...rest }: HTMLAttributes<HTMLElement>) {
  return <section className={cn('rounded-lg border border-rule bg-surface shadow-sm', className)} {...rest} />;
}

interface CardHeaderProps {
  title: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  /** Heading level that fits the page outline; h2 by default. */
  as?: 'h2' | 'h3';
  id?: string;
}

export function CardHeader({ title, description, actions, as: Heading = 'h2', id }: CardHeaderProps) {
  return (
    <div className="flex flex-wrap items-start justify-between gap-3 border-b border-rule px-5 py-4">
      <div className="min-w-0">
        <Heading id={id} className="text-base font-semibold text-ink-950">
          {title}
        </Heading>
        {description && <p className="mt-0.5 text-sm text-ink-600">{description}</p>}
      </div>
      {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
    </div>
  );
}

export function CardBody({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cn('px-5 py-4', className)} {...rest} />;
}
