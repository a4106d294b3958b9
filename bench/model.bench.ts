/**
 * Benchmark of the season computation's batch path: 5,000 districts × 365 days × 5 profiles,
 * deterministic weather (seeded per district), typed-array columns, one preallocated output reused
 * throughout. Prints days per second and seconds for one thread and for worker threads (one per core
 * by default), beside the floor: a bare loop over the same numbers (summing Tmin + Tmax), with the ratio.
 *
 * Run: npm run bench:model   (options: --districts N --days N --seed N --workers N)
 */
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { computeSeasonColumns, createSeasonColumns, compileProfile, profiles } from '../shared/model';
import { seededRandom } from '../sample/random';

interface Config {
  districts: number;
  days: number;
  seed: number;
}

/** The demo's seeded generator (mulberry32), so the bench weather is the same on every machine. */
const prng = seededRandom;

interface Weather {
  first: number;
  count: number;
  lat: Float64Array;
  tmin: Float64Array;
  tmax: Float64Array;
  rh: Float64Array;
  gaps: number;
}

/** Weather for districts [first, first + count): each district has its own seed, so any split gives the same data. */
function weather(cfg: Config, first: number, count: number): Weather {
  const D = cfg.days;
  const w: Weather = { first, count, lat: new Float64Array(count), tmin: new Float64Array(count * D), tmax: new Float64Array(count * D), rh: new Float64Array(count * D), gaps: 0 };
  for (let j = 0; j < count; j++) {
    const rand = prng(cfg.seed ^ Math.imul(first + j + 1, 0x9e3779b1));
    const lat = 5 + 45 * rand(); // 5°–50° N
    w.lat[j] = lat;
    const annualMean = 30 - 0.35 * lat + 3 * (rand() - 0.5);
    const amplitude = 2 + 0.25 * lat;
    const range = 6 + 8 * rand();
    let anomaly = 0;
    for (let i = 0; i < D; i++) {
      anomaly = 0.8 * anomaly + 3 * (rand() - 0.5);
      const mean = annualMean - amplitude * Math.cos((2 * Math.PI * (i - 15)) / 365) + anomaly;
      const r = range * (0.7 + 0.6 * rand());
      const k = j * D + i;
      if (rand() < 0.003) {
        w.tmin[k] = w.tmax[k] = Number.NaN; // a gap the intake could not fill
        w.gaps++;
      } else {
        w.tmin[k] = mean - r / 2;
        w.tmax[k] = mean + r / 2;
      }
      w.rh[k] = 40 + 50 * rand();
    }
  }
  return w;
}

/** Run all profiles over the given weather; returns seconds and a checksum. */
function runModel(cfg: Config, w: Weather): { seconds: number; checksum: number } {
  const D = cfg.days;
  const compiled = profiles.map((p) => compileProfile(p)); // the optimum search and trait table: once per profile
  const out = createSeasonColumns(D);
  let checksum = 0;
  const t0 = performance.now();
  for (const cp of compiled) {
    for (let j = 0; j < w.count; j++) {
      const off = j * D;
      computeSeasonColumns(
        cp,
        { lat: w.lat[j], biofix: '2023-03-01' },
        { startDate: '2023-01-01', tmin: w.tmin.subarray(off, off + D), tmax: w.tmax.subarray(off, off + D), rh: w.rh.subarray(off, off + D) },
        out,
      );
      checksum += out.cumulativeDegreeDays[D - 1] + out.relativeVectorialCapacity[D - 1];
    }
  }
  return { seconds: (performance.now() - t0) / 1000, checksum };
}

/** The floor: a bare loop over the same numbers, as many times as there are profiles. */
function runFloor(cfg: Config, w: Weather, reps: number): { seconds: number; sum: number } {
  const D = cfg.days;
  let sum = 0;
  const t0 = performance.now();
  for (let rep = 0; rep < reps; rep++) {
    for (let j = 0; j < w.count; j++) {
      const a = w.tmin.subarray(j * D, (j + 1) * D);
      const b = w.tmax.subarray(j * D, (j + 1) * D);
      for (let i = 0; i < D; i++) {
        const s = a[i] + b[i];
        if (s === s) sum += s;
      }
    }
  }
  return { seconds: (performance.now() - t0) / 1000, sum };
}

// ------------------------------------------------------------------------------------------------
// Worker: generate its share, say ready, run on "go", report.
if (!isMainThread) {
  const { cfg, first, count } = workerData as { cfg: Config; first: number; count: number };
  const w = weather(cfg, first, count);
  parentPort!.once('message', () => {
    const r = runModel(cfg, w);
    parentPort!.postMessage(r);
  });
  parentPort!.postMessage('ready');
} else {
  await main();
}

function option(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  const v = i >= 0 ? Number(process.argv[i + 1]) : fallback;
  if (!Number.isInteger(v) || v <= 0) {
    process.stderr.write(`--${name}: expected a positive integer\n`);
    process.exit(2);
  }
  return v;
}

async function runWorkers(cfg: Config, n: number): Promise<{ wallSeconds: number; slowestSeconds: number; checksum: number }> {
  const per = Math.ceil(cfg.districts / n);
  const url = JSON.stringify(import.meta.url);
  const workers = Array.from({ length: n }, (_, k) => {
    const first = k * per;
    const count = Math.max(0, Math.min(per, cfg.districts - first));
    // The worker registers tsx itself (the loader of the main thread does not reach workers).
    return new Worker(`import('tsx/esm/api').then((m) => { m.register(); return import(${url}); })`, { eval: true, workerData: { cfg, first, count } });
  });
  await Promise.all(workers.map((w) => new Promise<void>((res, rej) => { w.once('message', () => res()); w.once('error', rej); })));
  const t0 = performance.now();
  const results = await Promise.all(
    workers.map((w) => new Promise<{ seconds: number; checksum: number }>((res, rej) => { w.once('message', res); w.once('error', rej); w.postMessage('go'); })),
  );
  const wall = (performance.now() - t0) / 1000;
  await Promise.all(workers.map((w) => w.terminate()));
  return { wallSeconds: wall, slowestSeconds: Math.max(...results.map((r) => r.seconds)), checksum: results.reduce((s, r) => s + r.checksum, 0) };
}

async function main(): Promise<void> {
  const cfg: Config = { districts: option('districts', 5000), days: option('days', 365), seed: option('seed', 20240601) };
  const nWorkers = option('workers', Math.max(1, availableParallelism()));
  const tGen0 = performance.now();
  const w = weather(cfg, 0, cfg.districts);
  const tGen = (performance.now() - tGen0) / 1000;
  const districtDays = cfg.districts * cfg.days * profiles.length;

  const single = runModel(cfg, w);
  const floor = runFloor(cfg, w, profiles.length);
  const par = await runWorkers(cfg, nWorkers);

  const fmt = (x: number) => Math.round(x).toLocaleString('en');
  console.log(`${fmt(districtDays)} district-days (${cfg.districts} districts × ${cfg.days} days × ${profiles.length} profiles), ${w.gaps} gap days`);
  console.log(`season model, 1 thread:   ${single.seconds.toFixed(3)} s = ${fmt(districtDays / single.seconds)} days/s`);
  console.log(`season model, ${nWorkers} workers:  ${par.wallSeconds.toFixed(3)} s wall = ${fmt(districtDays / par.wallSeconds)} days/s`);
  console.log(`bare loop (floor):        ${floor.seconds.toFixed(4)} s = ${fmt(districtDays / floor.seconds)} days/s; model / floor = ${(single.seconds / floor.seconds).toFixed(1)}× (1 thread)`);
  console.log(`goal (< 2 s for the whole set): 1 thread ${single.seconds < 2 ? 'met' : 'not met'}, ${nWorkers} workers ${par.wallSeconds < 2 ? 'met' : 'not met'}`);
  console.log(
    JSON.stringify({
      districts: cfg.districts,
      days: cfg.days,
      profiles: profiles.map((p) => p.id),
      districtDays,
      gapDays: w.gaps,
      weatherGenerationSeconds: +tGen.toFixed(3),
      singleThread: { seconds: +single.seconds.toFixed(3), daysPerSecond: Math.round(districtDays / single.seconds) },
      workers: { count: nWorkers, wallSeconds: +par.wallSeconds.toFixed(3), slowestWorkerSeconds: +par.slowestSeconds.toFixed(3), daysPerSecond: Math.round(districtDays / par.wallSeconds) },
      floor: { seconds: +floor.seconds.toFixed(4), daysPerSecond: Math.round(districtDays / floor.seconds) },
      ratioModelToFloor: +(single.seconds / floor.seconds).toFixed(1),
      checksumsAgree: Math.abs(single.checksum - par.checksum) < 1e-6 * Math.abs(single.checksum),
      floorChecksum: +floor.sum.toFixed(3),
    }),
  );
}
