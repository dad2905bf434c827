import { Link } from 'react-router';
import { PURPOSE_LABELS, STATUS_LABELS, type ProjectView } from '@shared/api/projects.schema.js';
import { Badge } from '@/components/ui/badge.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { formatDate } from '@/lib/format.js';
import { formatAreaKm2, STATUS_TONES } from './project-options.js';

const COLUMNS: Column<ProjectView>[] = [
  {
    key: 'title',
    header: 'Project',
    rowHeader: true,
    cell: (p) => (
      <Link to={`/projects/${p.id}`} className="text-mulberry-800 underline-offset-2 hover:underline">
        {p.title}
      </Link>
    ),
  },
  { key: 'client', header: 'Client', cell: (p) => p.clientName },
  { key: 'purpose', header: 'Purpose', cell: (p) => PURPOSE_LABELS[p.purpose] },
  { key: 'status', header: 'Status', cell: (p) => <Badge tone={STATUS_TONES[p.status]}>{STATUS_LABELS[p.status]}</Badge> },
  {
    key: 'region',
    header: 'Region',
    cell: (p) =>
      p.region ? (
        <span>
          {p.region.name} <span className="text-ink-600">· {formatAreaKm2(p.region.areaKm2)}</span>
        </span>
      ) : (
        <span className="text-ink-600">none yet</span>
      ),
  },
  { key: 'candidates', header: 'Candidates', align: 'right', cell: (p) => p.candidateCount },
  { key: 'audits', header: 'Audits', align: 'right', cell: (p) => p.auditCount },
  { key: 'updated', header: 'Updated', cell: (p) => formatDate(p.updatedAt) },
];

/** The project list; ordering comes from the server (the sort control above the table). */
export function ProjectsTable({ projects, caption }: { projects: readonly ProjectView[]; caption: string }) {
  return (
    <DataTable
      rows={projects}
      columns={COLUMNS}
      rowKey={(p) => p.id}
      caption={caption}
      empty="No project matches these filters."
    />
  );
}
