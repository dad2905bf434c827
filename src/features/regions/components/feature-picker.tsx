import { useMemo, useState } from 'react';
import type { RegionFeatureSummary } from '@shared/api/regions.schema.js';
import { Input } from '@/components/ui/input.js';
import { formatAreaKm2 } from '@/features/projects/components/project-options.js';
import type { FeatureChoice } from '../api/upload-region.js';

interface Props {
  features: readonly RegionFeatureSummary[];
  value: FeatureChoice;
  onChange: (next: FeatureChoice) => void;
}

/** Chooses the file's features that make up the region: all of them, or some, merged. */
export function FeaturePicker({ features, value, onChange }: Props) {
  const [filter, setFilter] = useState('');
  const shown = useMemo(() => {
    const f = filter.trim().toLowerCase();
    return f ? features.filter((x) => x.name.toLowerCase().includes(f)) : features;
  }, [features, filter]);
  const chosen = new Set(value === 'all' ? features.map((f) => f.index) : value);
  const toggle = (index: number) => {
    const next = new Set(chosen);
    if (next.has(index)) next.delete(index);
    else next.add(index);
    onChange(next.size === features.length ? 'all' : [...next].sort((a, b) => a - b));
  };
  const picked = features.filter((f) => chosen.has(f.index));
  const pickedKm2 = picked.reduce((sum, f) => sum + f.areaKm2, 0);
  const pickedVertices = picked.reduce((sum, f) => sum + f.vertexCount, 0);
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-medium text-ink-950">
        Features in the file ({features.length}) — {value === 'all' ? 'all picked' : `${chosen.size} picked`}, merged into one region
      </legend>
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className="text-sm text-mulberry-800 underline" onClick={() => onChange('all')}>
          Pick all
        </button>
        <button type="button" className="text-sm text-mulberry-800 underline" onClick={() => onChange([])}>
          Pick none
        </button>
        {features.length > 8 && (
          <Input aria-label="Filter features by name" placeholder="Filter by name" className="max-w-xs" value={filter} onChange={(e) => setFilter(e.target.value)} />
        )}
      </div>
      <ul className="max-h-64 overflow-y-auto rounded-md border border-rule">
        {shown.map((f) => (
          <li key={f.index} className="border-b border-rule last:border-b-0">
            <label className="flex cursor-pointer items-center gap-3 px-3 py-2 text-sm hover:bg-paper/60">
              <input type="checkbox" checked={chosen.has(f.index)} onChange={() => toggle(f.index)} className="size-4 accent-mulberry-700" />
              <span className="min-w-0 flex-1 truncate font-medium text-ink-950">{f.name}</span>
              <span className="text-ink-600 tabular">
                {f.partCount} part{f.partCount === 1 ? '' : 's'} · {new Intl.NumberFormat().format(f.vertexCount)} vertices · {formatAreaKm2(f.areaKm2)}
              </span>
            </label>
          </li>
        ))}
      </ul>
      <p className="text-sm text-ink-800" aria-live="polite">
        Picked: {picked.length} feature{picked.length === 1 ? '' : 's'}, {formatAreaKm2(pickedKm2)}, {new Intl.NumberFormat().format(pickedVertices)} vertices.
      </p>
    </fieldset>
  );
}
