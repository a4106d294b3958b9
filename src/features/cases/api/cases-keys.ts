/** Query keys of the Case ledger, general to specific: invalidating ['cases'] refreshes grids, signals and histories. */
export const casesKeys = {
  all: ['cases'] as const,
  settings: ['cases', 'settings'] as const,
  grid: (diseaseId: string, scope: string) => ['cases', 'grid', diseaseId, scope] as const,
  signals: (districtId: string, diseaseId: string, year: number | undefined) => ['cases', 'signals', districtId, diseaseId, year ?? 'current'] as const,
  revisions: (countId: string) => ['cases', 'revisions', countId] as const,
  count: (districtId: string, diseaseId: string, year: number, week: number) => ['cases', 'count', districtId, diseaseId, year, week] as const,
  diseases: ['diseases'] as const,
};
