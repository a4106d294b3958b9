import { DEFAULT_TIER_SETTINGS, DRIVER_LABELS } from '../../../shared/tier';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

export const ladderRow = (n: number, over: Record<string, unknown> = {}) => ({
  districtId: id(n),
  code: `HV-${String(n).padStart(2, '0')}`,
  name: `District ${n}`,
  isDemo: true,
  region: null,
  rank: n,
  tier: 'baseline',
  tierLow: 'baseline',
  tierHigh: 'baseline',
  score: 0.1,
  tierChange: 0,
  scoreChange: 0,
  leadingDriver: 'climate',
  changedDriver: null,
  confidence: 'ok',
  casesThisWeek: 0,
  casesWeek: { year: 2025, week: 21 },
  casesDiseases: [{ code: 'DENV', name: 'Dengue' }],
  channelZone: 'within',
  latestWeather: '2025-06-01',
  profileId: 'aedes-aegypti-dengue',
  ...over,
});

export const demoBoardRows = [
  ladderRow(1, { name: 'Saltmarsh Coast', code: 'HV-01', tier: 'critical', tierLow: 'high', tierHigh: 'critical', score: 0.81, tierChange: 1, scoreChange: 0.12, leadingDriver: 'cases', casesThisWeek: 42, channelZone: 'above' }),
  ladderRow(2, { name: 'Orrin Valley', code: 'HV-02', rank: 2, tier: 'high', tierLow: 'high', tierHigh: 'high', score: 0.55, tierChange: -1, scoreChange: -0.08, leadingDriver: 'vectorClock', casesThisWeek: 7, confidence: 'stale' }),
  ladderRow(3, { name: 'Korrin Bay', code: 'HV-03', rank: 3, tier: 'raised', tierLow: 'baseline', tierHigh: 'raised', score: 0.3, tierChange: null, scoreChange: null, leadingDriver: 'larval', casesThisWeek: 15, channelZone: 'below' }),
  ladderRow(4, { name: 'Pellam Highlands', code: 'HV-04', rank: 4, score: 0.05, leadingDriver: null, casesThisWeek: null, channelZone: null, latestWeather: null, confidence: 'insufficient' }),
];

export const demoBoard = { epiYear: 2025, epiWeek: 22, asOf: '2025-06-01', computedAt: '2025-06-02T02:00:00.000Z', rows: demoBoardRows };

const square = (x: number) => ({ type: 'Polygon', coordinates: [[[x, 24], [x + 1, 24], [x + 1, 25], [x, 25], [x, 24]]] });
export const demoBoundaries = {
  type: 'FeatureCollection',
  features: demoBoardRows.map((r, i) => ({ type: 'Feature', id: r.districtId, properties: { id: r.districtId, code: r.code, name: r.name }, geometry: square(50 + i) })),
};

const driver = (key: keyof typeof DRIVER_LABELS, score: number | null, contribution: number, detail: Record<string, unknown>) => ({
  id: key,
  label: DRIVER_LABELS[key],
  score,
  weight: DEFAULT_TIER_SETTINGS.weights[key],
  contribution,
  detail,
});

const days = Array.from({ length: 20 }, (_, i) => `2025-05-${String(i + 1).padStart(2, '0')}`);
const series = <T,>(f: (i: number) => T) => days.map((_, i) => f(i));

export const demoDistrictFile = (seasonYear = 2025) => ({
  district: { id: id(1), code: 'HV-01', name: 'Saltmarsh Coast', isDemo: true, lat: 24.5, lon: 51.2 },
  seasonYear,
  seasons: [2025, 2024, 2023],
  profiles: [{ profileId: 'aedes-aegypti-dengue', profileName: 'Aedes aegypti – dengue', biofix: '03-15', defaultBiofix: '01-01', assignedBy: 'Ada Admin', assignedAt: '2025-03-01T09:00:00.000Z' }],
  weather: {
    dates: days,
    tmin: series((i) => 22 + i / 10),
    tmax: series((i) => 31 + i / 10),
    rh: series(() => 70),
    rain: series((i) => (i % 5 === 0 ? 4 : 0)),
    filled: series((i) => i === 3),
    source: 'two stations inside the district',
  },
  vectorClock: [
    {
      profileId: 'aedes-aegypti-dengue',
      profileName: 'Aedes aegypti with dengue',
      dates: days,
      cumulativeDegreeDays: series((i) => i * 15),
      generations: series((i) => i / 6),
      eipDays: series(() => 9.5),
      survivalThroughEip: series(() => 0.42),
      rvc: series(() => 0.6),
      rvcLow: series(() => 0.4),
      rvcHigh: series(() => 0.8),
      seasonOpen: series(() => true),
      complete: series(() => true),
    },
  ],
  cases: [
    {
      diseaseId: id(50),
      diseaseName: 'Dengue',
      weeks: [19, 20, 21, 22],
      counts: [10, 18, 30, 42],
      channel: { lower: [2, 2, 3, 3], centre: [6, 7, 8, 9], upper: [14, 15, 16, 18], method: 'mean ± 2 SD of 5 prior seasons' },
      priorSeasons: [{ year: 2024, counts: [5, 6, 8, 9] }],
    },
  ],
  larval: [
    { epiYear: 2025, epiWeek: 21, surveys: 3, pupaSurveys: 2, house: 12, container: 8, breteau: 18, pupa: 0.4 },
    { epiYear: 2025, epiWeek: 22, surveys: 2, pupaSurveys: 0, house: 15, container: 9, breteau: 24, pupa: null },
  ],
  tiers: [
    {
      epiYear: seasonYear, epiWeek: 21, tier: 'high', tierLow: 'high', tierHigh: 'high', score: 0.69, confidence: 'ok',
      drivers: [driver('climate', 0.6, 0.18, { rvc14: 0.6, seasonOpen: true }), driver('vectorClock', 0.5, 0.1, { eipShare: 0.5, generationsRatio: 1 }), driver('larval', 0.4, 0.06, { breteau: 18, house: 12 }), driver('cases', 1, 0.35, { zone: 'above', aberrationAlarm: false, growthRatio: 1.6, cases: 30 })],
      notes: [], leadingDriver: 'cases', changedDriver: null,
    },
    {
      epiYear: seasonYear, epiWeek: 22, tier: 'critical', tierLow: 'high', tierHigh: 'critical', score: 0.81, confidence: 'stale',
      drivers: [driver('climate', 0.6, 0.18, { rvc14: 0.6, seasonOpen: true }), driver('vectorClock', 0.6, 0.12, { eipShare: 0.42, generationsRatio: 1.6 }), driver('larval', 0.48, 0.07, { breteau: 24, house: 15 }), driver('cases', 1, 0.44, { zone: 'above', aberrationAlarm: true, growthRatio: 1.4, cases: 42 })],
      notes: ['The newest weather is 5 days old.'], leadingDriver: 'cases', changedDriver: 'cases',
    },
  ],
});

export const seasonRun = (over: Record<string, unknown> = {}) => ({
  id: id(70),
  kind: 'manual',
  full: false,
  status: 'running',
  startedAt: '2025-06-02T08:00:00.000Z',
  finishedAt: null,
  asOf: '2025-06-01',
  districtsTotal: 12,
  districtsDone: 3,
  districtsSkipped: 0,
  rowsWritten: 1200,
  districtsFailed: 0,
  warnings: [],
  error: null,
  ...over,
});
