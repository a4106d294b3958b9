/**
 * Benchmark of the season computation's batch path: 5,000 districts × 365 days × 5 profiles,
 * deterministic weather (seeded), typed-array columns, one preallocated output reused throughout.
 * Prints days per second and seconds, beside the floor: a bare loop over the same numbers.
 * Run: npm run bench:model   (options: --districts N --days N --seed N)
 */
import { computeSeasonColumns, createSeasonColumns, compileProfile, profiles } from '../shared/model';

function option(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  const v = i >= 0 ? Number(process.argv[i + 1]) : fallback;
  if (!Number.isInteger(v) || v <= 0) {
    process.stderr.write(`--${name}: expected a positive integer\n`);
    process.exit(2);
  }
  return v;
}

const DISTRICTS = option('districts', 5000);
const DAYS = option('days', 365);
const SEED = option('seed', 20240601);

/** mulberry32: small, fast, seeded PRNG. */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// ---- weather: one flat array per variable, district d at [d*DAYS, (d+1)*DAYS)
const t0 = performance.now();
const rand = prng(SEED);
const N = DISTRICTS * DAYS;
const tmin = new Float64Array(N);
const tmax = new Float64Array(N);
const rh = new Float64Array(N);
const lat = new Float64Array(DISTRICTS);
let gaps = 0;
for (let d = 0; d < DISTRICTS; d++) {
  lat[d] = 5 + 45 * rand(); // 5°–50° N
  const annualMean = 30 - 0.35 * lat[d] + 3 * (rand() - 0.5);
  const amplitude = 2 + 0.25 * lat[d];
  const range = 6 + 8 * rand();
  let anomaly = 0;
  for (let i = 0; i < DAYS; i++) {
    anomaly = 0.8 * anomaly + 1.5 * (rand() - 0.5) * 2;
    const mean = annualMean - amplitude * Math.cos((2 * Math.PI * (i - 15)) / 365) + anomaly;
    const r = range * (0.7 + 0.6 * rand());
    const k = d * DAYS + i;
    if (rand() < 0.003) {
      tmin[k] = tmax[k] = Number.NaN; // a gap the intake could not fill
      gaps++;
    } else {
      tmin[k] = mean - r / 2;
      tmax[k] = mean + r / 2;
    }
    rh[k] = 40 + 50 * rand();
  }
}
const tGen = performance.now() - t0;

// ---- model
const compiled = profiles.map((p) => compileProfile(p)); // the optimum search is per profile, once
const out = createSeasonColumns(DAYS);
let checksum = 0;
const tModel0 = performance.now();
for (const cp of compiled) {
  for (let d = 0; d < DISTRICTS; d++) {
    const off = d * DAYS;
    computeSeasonColumns(
      cp,
      { lat: lat[d], biofix: '2023-03-01' },
      { startDate: '2023-01-01', tmin: tmin.subarray(off, off + DAYS), tmax: tmax.subarray(off, off + DAYS), rh: rh.subarray(off, off + DAYS) },
      out,
    );
    checksum += out.cumulativeDegreeDays[DAYS - 1] + out.relativeVectorialCapacity[DAYS - 1];
  }
}
const tModel = (performance.now() - tModel0) / 1000;

// ---- floor: a bare loop over the same numbers, the same number of times
let floorSum = 0;
const tFloor0 = performance.now();
for (let rep = 0; rep < compiled.length; rep++) {
  for (let d = 0; d < DISTRICTS; d++) {
    const a = tmin.subarray(d * DAYS, (d + 1) * DAYS);
    const b = tmax.subarray(d * DAYS, (d + 1) * DAYS);
    for (let i = 0; i < DAYS; i++) {
      const s = a[i] + b[i];
      if (s === s) floorSum += s;
    }
  }
}
const tFloor = (performance.now() - tFloor0) / 1000;

const districtDays = DISTRICTS * DAYS * compiled.length;
const result = {
  districts: DISTRICTS,
  days: DAYS,
  profiles: compiled.map((c) => c.profile.id),
  gapDays: gaps,
  weatherGenerationSeconds: +(tGen / 1000).toFixed(3),
  modelSeconds: +tModel.toFixed(3),
  modelDaysPerSecond: Math.round(districtDays / tModel),
  floorSeconds: +tFloor.toFixed(4),
  floorDaysPerSecond: Math.round(districtDays / tFloor),
  ratioModelToFloor: +(tModel / tFloor).toFixed(1),
  goal: 'all district-days of the 5 profiles in under 2 s',
  goalMet: tModel < 2,
  checksum: +checksum.toFixed(6),
  floorChecksum: +floorSum.toFixed(3),
};
console.log(`season model: ${districtDays.toLocaleString('en')} district-days in ${tModel.toFixed(3)} s = ${Math.round(districtDays / tModel).toLocaleString('en')} days/s`);
console.log(`bare loop:    ${districtDays.toLocaleString('en')} district-days in ${tFloor.toFixed(4)} s = ${Math.round(districtDays / tFloor).toLocaleString('en')} days/s (floor)`);
console.log(`ratio model / floor: ${(tModel / tFloor).toFixed(1)}×; goal < 2 s: ${tModel < 2 ? 'met' : 'NOT met'}`);
console.log(JSON.stringify(result));
