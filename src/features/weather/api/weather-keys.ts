/** Query keys of the weather screens, from general to specific (['weather'] invalidates them all). */
export const weatherKeys = {
  all: ['weather'] as const,
  stations: ['weather', 'stations'] as const,
  uploads: ['weather', 'uploads'] as const,
  upload: (id: string) => ['weather', 'uploads', id] as const,
  issues: (id: string, offset: number) => ['weather', 'uploads', id, 'issues', offset] as const,
  conflicts: ['weather', 'conflicts'] as const,
  series: (districtId: string) => ['weather', 'series', districtId] as const,
};
