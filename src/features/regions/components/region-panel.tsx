import { useQuery } from '@tanstack/react-query';
import { Alert } from '@/components/ui/alert.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { EmptyState } from '@/components/ui/empty-state.js';
import { Spinner } from '@/components/ui/spinner.js';
import { currentRegionQueryOptions } from '../api/get-current-region.js';
import { regionsQueryOptions } from '../api/get-regions.js';
import { RegionHistory } from './region-history.js';
import { RegionPreviewMap } from './region-preview-map.js';
import { RegionUpload } from './region-upload.js';
import { ValidationReport } from './validation-report.js';

/** The Region tab: the current region (map, report, provenance), the upload, the history. */
export function RegionPanel({ projectId, canEdit }: { projectId: number; canEdit: boolean }) {
  const current = useQuery(currentRegionQueryOptions(projectId));
  const history = useQuery(regionsQueryOptions(projectId));
  if (current.isPending) return <Spinner label="Loading the region…" />;
  if (current.isError) return <Alert tone="error">The region could not be loaded: {current.error.message}</Alert>;
  const region = current.data.region;
  return (
    <div className="flex flex-col gap-6">
      <Card aria-labelledby="region-current">
        <CardHeader id="region-current" title={region ? region.name : 'No region yet'} description={region ? `From ${region.sourceFileName}` : undefined} />
        <CardBody>
          {region ? (
            <div className="grid gap-6 lg:grid-cols-[minmax(0,24rem)_1fr]">
              <RegionPreviewMap region={region} />
              <div className="flex flex-col gap-3">
                <ValidationReport report={region.report} />
                <p className="text-xs break-all text-ink-600">
                  SHA-256 of the geometry: <code>{region.sha256}</code>
                </p>
                <details className="text-xs text-ink-600">
                  <summary className="cursor-pointer">Source CRS</summary>
                  <code className="mt-1 block break-all">{region.sourceCrs}</code>
                </details>
              </div>
            </div>
          ) : (
            <EmptyState title="Upload the region you are mapping" description="Its boundary is what every candidate projection is measured over." />
          )}
        </CardBody>
      </Card>
      {canEdit && (
        <Card aria-labelledby="region-upload">
          <CardHeader id="region-upload" title={region ? 'Replace the region' : 'Upload the region'} description="Earlier regions stay in the history; audits keep the region they ran on." />
          <CardBody>
            <RegionUpload projectId={projectId} />
          </CardBody>
        </Card>
      )}
      {history.data && history.data.regions.length > 1 && (
        <Card aria-labelledby="region-history">
          <CardHeader id="region-history" title="Earlier uploads" />
          <RegionHistory regions={history.data.regions} />
        </Card>
      )}
    </div>
  );
}
