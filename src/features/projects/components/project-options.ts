import {
  MAP_PURPOSES,
  PROJECT_STATUSES,
  PURPOSE_LABELS,
  SCALE_BAND_LABELS,
  SCALE_BANDS,
  STATUS_LABELS,
  type ProjectStatusName,
} from '@shared/api/projects.schema.js';
import type { BadgeTone } from '@/components/ui/badge.js';

export const PURPOSE_OPTIONS = MAP_PURPOSES.map((value) => ({ value, label: PURPOSE_LABELS[value] }));
export const SCALE_BAND_OPTIONS = SCALE_BANDS.map((value) => ({ value, label: SCALE_BAND_LABELS[value] }));
export const STATUS_OPTIONS = PROJECT_STATUSES.map((value) => ({ value, label: STATUS_LABELS[value] }));

export const STATUS_TONES: Record<ProjectStatusName, BadgeTone> = {
  draft: 'neutral',
  auditing: 'brand',
  'in-review': 'highlight',
  returned: 'warning',
  'signed-off': 'success',
};

/** "12 345 km²" with the reader's digit grouping. */
export const formatAreaKm2 = (km2: number) =>
  `${new Intl.NumberFormat(undefined, { maximumFractionDigits: km2 < 100 ? 1 : 0 }).format(km2)} km²`;
