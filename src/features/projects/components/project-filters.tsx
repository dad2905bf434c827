import { useEffect, useState } from 'react';
import type { ListProjectsQuery } from '@shared/api/projects.schema.js';
import { SelectField, TextField } from '@/components/ui/form-field.js';
import { PURPOSE_OPTIONS, STATUS_OPTIONS } from './project-options.js';

const SORT_OPTIONS = [
  { value: 'updated', label: 'Recently updated' },
  { value: 'title', label: 'Title A–Z' },
  { value: 'status', label: 'Status' },
];

interface Props {
  query: ListProjectsQuery;
  onChange: (next: ListProjectsQuery) => void;
}

/** Search (applied after a short pause in typing), status and purpose filters, and the sort order. */
export function ProjectFilters({ query, onChange }: Props) {
  const [text, setText] = useState(query.q ?? '');
  useEffect(() => {
    if ((query.q ?? '') === text) return;
    const t = setTimeout(() => onChange({ ...query, q: text || undefined }), 300);
    return () => clearTimeout(t);
  }, [text, query, onChange]);
  return (
    <form role="search" aria-label="Find projects" onSubmit={(e) => e.preventDefault()} className="grid gap-3 sm:grid-cols-4">
      <TextField label="Search" type="search" placeholder="Title, client or notes" value={text} onChange={(e) => setText(e.target.value)} />
      <SelectField
        label="Status"
        options={[{ value: '', label: 'Any status' }, ...STATUS_OPTIONS]}
        value={query.status ?? ''}
        onChange={(e) => onChange({ ...query, status: (e.target.value || undefined) as ListProjectsQuery['status'] })}
      />
      <SelectField
        label="Purpose"
        options={[{ value: '', label: 'Any purpose' }, ...PURPOSE_OPTIONS]}
        value={query.purpose ?? ''}
        onChange={(e) => onChange({ ...query, purpose: (e.target.value || undefined) as ListProjectsQuery['purpose'] })}
      />
      <SelectField
        label="Sort by"
        options={SORT_OPTIONS}
        value={query.sort ?? 'updated'}
        onChange={(e) => onChange({ ...query, sort: e.target.value as ListProjectsQuery['sort'] })}
      />
    </form>
  );
}
