import { useId, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { cn } from '@/lib/cn.js';

export interface ProjectTab {
  id: string;
  label: string;
  render: () => ReactNode;
}

/**
 * Tabs with the keyboard behaviour of the WAI-ARIA tabs pattern (arrow keys, Home, End move
 * between tabs). Only the selected panel is rendered, so each tab loads its data when opened.
 */
export function ProjectTabs({ tabs, selected, onSelect }: { tabs: readonly ProjectTab[]; selected: string; onSelect: (id: string) => void }) {
  const base = useId();
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const current = tabs.find((t) => t.id === selected) ?? tabs[0];
  const move = (e: KeyboardEvent, index: number) => {
    const last = tabs.length - 1;
    const next = e.key === 'ArrowRight' ? (index === last ? 0 : index + 1) : e.key === 'ArrowLeft' ? (index === 0 ? last : index - 1) : e.key === 'Home' ? 0 : e.key === 'End' ? last : -1;
    if (next < 0) return;
    e.preventDefault();
    onSelect(tabs[next].id);
    refs.current[next]?.focus();
  };
  return (
    <div className="flex flex-col gap-6">
      <div role="tablist" aria-label="Project sections" className="flex gap-1 border-b border-rule">
        {tabs.map((t, i) => {
          const active = t.id === current.id;
          return (
            <button
              key={t.id}
              ref={(el) => {
                refs.current[i] = el;
              }}
              type="button"
              role="tab"
              id={`${base}-tab-${t.id}`}
              aria-selected={active}
              aria-controls={`${base}-panel-${t.id}`}
              tabIndex={active ? 0 : -1}
              onClick={() => onSelect(t.id)}
              onKeyDown={(e) => move(e, i)}
              className={cn(
                '-mb-px border-b-2 px-4 py-2 text-sm font-medium',
                active ? 'border-mulberry-700 text-ink-950' : 'border-transparent text-ink-600 hover:text-ink-950',
              )}
            >
              {t.label}
            </button>
          );
        })}
      </div>
      <div role="tabpanel" id={`${base}-panel-${current.id}`} aria-labelledby={`${base}-tab-${current.id}`}>
        {current.render()}
      </div>
    </div>
  );
}
