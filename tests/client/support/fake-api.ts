import { vi } from 'vitest';

type Handler = (init: RequestInit) => Response | Promise<Response>;

export const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** Stubs fetch with handlers keyed "METHOD /path"; anything else answers 404. */
export function fakeApi(handlers: Record<string, Handler>) {
  const fetchMock = vi.fn(async (input: string | URL | Request, init: RequestInit = {}) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const path = new URL(url, 'http://localhost').pathname;
    const key = `${(init.method ?? 'GET').toUpperCase()} ${path}`;
    const handler = handlers[key];
    return handler ? handler(init) : json(404, { error: { code: 'not_found', message: `${key} was not found.` } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

export const demoDistricts = [
  { id: id(1), code: 'HV-01', name: 'Saltmarsh Coast', isDemo: true, populations: [{ year: 2023, population: 81000 }, { year: 2024, population: 82500 }], hasBoundary: true, centroid: { lat: 24.5, lon: 51.2 } },
  { id: id(2), code: 'HV-02', name: 'Orrin Valley', isDemo: true, populations: [], hasBoundary: false, centroid: null },
];

export const adminMe = {
  id: id(100), email: 'admin@halvern.example', displayName: 'Ada Admin', role: 'admin', districts: [],
  preferences: { language: 'en', temperatureUnit: 'C', rainUnit: 'mm' },
};
export const officerMe = { ...adminMe, id: id(101), email: 'officer@halvern.example', displayName: 'Otto Officer', role: 'officer' };

export const demoUsers = [
  { ...adminMe, active: true, invitePending: false, createdAt: '2025-01-01T00:00:00.000Z' },
  { id: id(102), email: 'worker@halvern.example', displayName: 'Wen Worker', role: 'worker', active: true, invitePending: true, districts: [{ id: id(2), code: 'HV-02', name: 'Orrin Valley' }], createdAt: '2025-01-02T00:00:00.000Z' },
];
