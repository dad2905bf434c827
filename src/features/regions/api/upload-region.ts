import { useMutation, useQueryClient } from '@tanstack/react-query';
import { regionSchema } from '@shared/api/regions.schema.js';
import { projectQueryOptions } from '@/features/projects/api/get-project.js';
import { projectListsKey } from '@/features/projects/api/get-projects.js';
import { sendMultipart, type UploadProgress } from './send-multipart.js';

/** Which features of the file become the region: all of them, or these indexes merged. */
export type FeatureChoice = 'all' | number[];

/** `POST /api/projects/:projectId/regions`: stores the picked features as the current region. */
export function uploadRegion(projectId: number, file: File, features: FeatureChoice, onProgress?: (p: UploadProgress) => void) {
  const form = new FormData();
  form.append('features', features === 'all' ? 'all' : features.join(','));
  form.append('file', file, file.name);
  return sendMultipart(`/projects/${projectId}/regions`, form, regionSchema, onProgress);
}

export function useUploadRegion(projectId: number, onProgress?: (p: UploadProgress) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, features }: { file: File; features: FeatureChoice }) => uploadRegion(projectId, file, features, onProgress),
    // The region, its history, the proposals fitted to it and the project's summary all change.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: projectQueryOptions(projectId).queryKey }),
        queryClient.invalidateQueries({ queryKey: projectListsKey }),
      ]),
  });
}
