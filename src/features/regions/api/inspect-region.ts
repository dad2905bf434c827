import { useMutation } from '@tanstack/react-query';
import { regionInspectionSchema } from '@shared/api/regions.schema.js';
import { sendMultipart, type UploadProgress } from './send-multipart.js';

/** `POST /api/projects/:projectId/regions/inspect`: reads and checks a file, lists its features; stores nothing. */
export function inspectRegion(projectId: number, file: File, onProgress?: (p: UploadProgress) => void) {
  const form = new FormData();
  form.append('file', file, file.name);
  return sendMultipart(`/projects/${projectId}/regions/inspect`, form, regionInspectionSchema, onProgress);
}

export function useInspectRegion(projectId: number, onProgress?: (p: UploadProgress) => void) {
  return useMutation({ mutationFn: (file: File) => inspectRegion(projectId, file, onProgress) });
}
