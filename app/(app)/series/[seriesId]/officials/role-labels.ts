import type { SeriesOfficialRole } from '@/lib/core/inputs/series';

export const SERIES_ROLE_LABEL: Record<SeriesOfficialRole, string> = {
  series_secretary: 'Series secretary',
  series_steward: 'Series steward',
};
