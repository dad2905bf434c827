import type { ReactNode } from 'react';

/** The heading, intro and body shared by every signed-out page. */
export function AuthCard({ title, intro, children, footer }: { title: string; intro?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div>
      <title>{`${title} · Warpmeter`}</title>
      <h1 className="text-2xl font-semibold tracking-tight text-ink-950">{title}</h1>
      {intro && <div className="mt-1.5 text-sm text-ink-600">{intro}</div>}
      <div className="mt-6">{children}</div>
      {footer && <div className="mt-6 border-t border-rule pt-4 text-sm text-ink-600">{footer}</div>}
    </div>
  );
}
