import type { RegionView } from '@shared/api/regions.schema.js';
import { Badge } from '@/components/ui/badge.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { formatAreaKm2 } from '@/features/projects/components/project-options.js';
import { formatDate } from '@/lib/format.js';

const COLUMNS: Column<RegionView>[] = [
  { key: 'name', header: 'Region', rowHeader: true, cell: (r) => r.name, sortValue: (r) => r.name },
  { key: 'file', header: 'File', cell: (r) => `${r.sourceFileName} (${r.sourceFormat})` },
  { key: 'area', header: 'Area', align: 'right', cell: (r) => formatAreaKm2(r.areaKm2), sortValue: (r) => r.areaKm2 },
  { key: 'vertices', header: 'Vertices', align: 'right', cell: (r) => r.vertexCount, sortValue: (r) => r.vertexCount },
  { key: 'when', header: 'Uploaded', cell: (r) => formatDate(r.createdAt), sortValue: (r) => r.createdAt },
  { key: 'current', header: 'In use', cell: (r) => (r.isCurrent ? <Badge tone="success">current</Badge> : null) },
];

/** Every region uploaded to the project; audits keep the one they ran on. */
export function RegionHistory({ regions }: { regions: readonly RegionView[] }) {
  return <DataTable rows={regions} columns={COLUMNS} rowKey={(r) => r.id} caption="Uploads, newest first" captionHidden />;
}
