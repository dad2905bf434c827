import { useState } from 'react';
import { REGION_FILE_ACCEPT, REGION_UPLOAD_MAX_BYTES, type RegionInspection } from '@shared/api/regions.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { FormField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { useInspectRegion } from '../api/inspect-region.js';
import type { UploadProgress } from '../api/send-multipart.js';
import { useUploadRegion, type FeatureChoice } from '../api/upload-region.js';
import { FeaturePicker } from './feature-picker.js';
import { UploadProgressBar } from './upload-progress.js';
import { ValidationReport } from './validation-report.js';

const messageOf = (err: unknown) => (isApiError(err) ? err.message : 'The file could not be sent. Please try again.');

/**
 * Two steps: the file is sent and checked (nothing stored), the person picks features and reads
 * the validation report, then the picked features are stored as the project's current region.
 */
export function RegionUpload({ projectId, onStored }: { projectId: number; onStored?: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [inspection, setInspection] = useState<RegionInspection | null>(null);
  const [choice, setChoice] = useState<FeatureChoice>('all');
  const [error, setError] = useState<string | null>(null);
  // Remounts the file input on "start over": a file input's chosen file cannot be set from state.
  const [inputKey, setInputKey] = useState(0);
  const inspect = useInspectRegion(projectId, setProgress);
  const store = useUploadRegion(projectId, setProgress);
  const { notify } = useToast();

  const pick = (f: File | null) => {
    setFile(f);
    setInspection(null);
    setChoice('all');
    setProgress(null);
    if (!f) setInputKey((k) => k + 1);
    setError(f && f.size > REGION_UPLOAD_MAX_BYTES ? `${f.name} is larger than 25 MB; simplify or split the boundary first.` : null);
  };

  const check = async () => {
    if (!file) return setError('Choose a file first.');
    setError(null);
    try {
      const result = await inspect.mutateAsync(file);
      setInspection(result);
      setChoice('all');
    } catch (err) {
      setError(messageOf(err));
    } finally {
      setProgress(null);
    }
  };

  const save = async () => {
    if (!file || !inspection) return;
    if (choice !== 'all' && choice.length === 0) return setError('Pick at least one feature.');
    setError(null);
    try {
      const region = await store.mutateAsync({ file, features: choice });
      notify(`Region “${region.name}” stored; it is now the project’s current region.`);
      pick(null);
      onStored?.();
    } catch (err) {
      setError(messageOf(err));
    } finally {
      setProgress(null);
    }
  };

  return (
    <div className="flex flex-col gap-4">
      <FormField label="Region file" hint="A zipped shapefile (.shp, .shx, .dbf and .prj), GeoJSON or TopoJSON; up to 25 MB." error={error ?? undefined}>
        {(control) => (
          <input
            {...control}
            key={inputKey}
            type="file"
            name="file"
            accept={REGION_FILE_ACCEPT}
            onChange={(e) => pick(e.target.files?.[0] ?? null)}
            className="text-sm file:mr-3 file:rounded-md file:border file:border-rule-strong file:bg-surface file:px-3 file:py-1.5 file:text-sm"
          />
        )}
      </FormField>
      {!inspection && (
        <div>
          <Button onClick={check} loading={inspect.isPending} disabled={!file || Boolean(error && file)}>
            Check the file
          </Button>
        </div>
      )}
      <UploadProgressBar progress={progress} label={inspect.isPending ? 'Sending the file to be checked' : 'Sending the file to be stored'} />
      {inspection && (
        <div className="flex flex-col gap-4 rounded-md border border-rule p-4">
          <Alert tone="success" title={`${inspection.fileName} reads as ${inspection.format}`}>
            {inspection.sourceCrs === 'EPSG:4326' ? 'Coordinates in WGS84 longitude/latitude.' : 'Reprojected from the CRS in its .prj to WGS84 longitude/latitude.'}
          </Alert>
          {inspection.features.length > 1 && <FeaturePicker features={inspection.features} value={choice} onChange={setChoice} />}
          {inspection.features.length > 1 && <h3 className="text-sm font-medium text-ink-950">Checks of the whole file</h3>}
          <ValidationReport report={inspection.report} />
          <div className="flex gap-2">
            <Button onClick={save} loading={store.isPending}>
              Use as the project’s region
            </Button>
            <Button variant="ghost" onClick={() => pick(null)}>
              Start over
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
