/**
 * Every TanStack Query key of the client, from general to specific, so that a mutation can invalidate a
 * whole family by its prefix (invalidating ['districts'] also refreshes ['districts', id]).
 */
export const queryKeys = {
  me: ['me'] as const,
  users: {
    all: ['users'] as const,
    detail: (id: string) => ['users', id] as const,
  },
  districts: {
    all: ['districts'] as const,
    detail: (id: string) => ['districts', id] as const,
  },
  regions: {
    all: ['regions'] as const,
  },
};
