// Column enumerations of a series' officials (pure: the models and lib/core/inputs/series.ts share them).
export const SERIES_OFFICIAL_ROLES = ['series_secretary', 'series_steward'] as const;
export type SeriesOfficialRole = (typeof SERIES_OFFICIAL_ROLES)[number];
