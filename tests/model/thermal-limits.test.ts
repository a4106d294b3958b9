import { describe, expect, it } from 'vitest';
import { computeSeason, eipDays, getProfile, loadProfiles, thermalR0, traitsAt, vectorialCapacityOptimum, type SeasonInputDay } from '../../shared/model';
import { EIP_MAX_DAYS, EIP_MIN_SURVIVAL } from '../../shared/model/traits';

// Thermal limits of transmission (issue 18, item 5). Before this fix the relative vectorial capacity
// of Ae. aegypti was 0.505 at 35 °C and 0.286 at 36 °C, that of An. / P. falciparum 0.65 at 35 °C and
// 0.28 at 37 °C, the Ae. aegypti EIP 184 days at 10 °C, and a cool Culex district drew EIPs of ~1e19 days.

const scan = (from: number, to: number, step: number) => Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);

/** Lowest and highest temperature of the 0.01 °C grid where f > 0, and where f peaks. */
function support(f: (t: number) => number): { lo: number; hi: number; peak: number } {
  let lo = Infinity;
  let hi = -Infinity;
  let best = 0;
  let peak = Number.NaN;
  for (const t of scan(0, 50, 0.01)) {
    const v = f(t);
    if (v > 0) {
      lo = Math.min(lo, t);
      hi = Math.max(hi, t);
    }
    if (v > best) {
      best = v;
      peak = t;
    }
  }
  return { lo, hi, peak };
}

describe('Ae. aegypti / dengue: Mordecai et al. 2017, PLoS Negl. Trop. Dis. 11:e0005568, trait fits (supplementary table) [pub, secondary transcription]', () => {
  const p = getProfile('aedes-aegypti-dengue');
  const rvc = (t: number) => traitsAt(p, t).relativeVectorialCapacity;

  it('when 35 °C and 36 °C, then the relative vectorial capacity is 0 (was 0.505 and 0.286), as their R0 is zero above 34.6 °C [derived, CHECK-VALUES]', () => {
    expect(rvc(35)).toBe(0);
    expect(rvc(36)).toBe(0);
    expect(rvc(34.5)).toBeGreaterThan(0);
  });

  it('when the capacity is scanned, then it is positive exactly from b\'s T0 17.05 °C to EFD\'s Tm 34.61 °C (the fits\' limits) and peaks at 29.0 °C [derived]', () => {
    const s = support(rvc);
    expect(s.lo).toBeCloseTo(17.06, 2); // first grid point above T0 of vector competence b (Brière, 17.05)
    expect(s.hi).toBeCloseTo(34.6, 2); // last grid point below Tm of eggs per female per day (Brière, 34.61)
    expect(s.peak).toBeCloseTo(29.0, 1);
    expect(vectorialCapacityOptimum(p).temperature).toBeCloseTo(29.0, 1);
  });

  it('when compared with the Mordecai-form R0 at every 0.5 °C, then the relative capacity is (R0 / R0 at its peak)² [derived: m ∝ EFD·pEA·MDR/μ², their eq. 1]', () => {
    const tPeak = vectorialCapacityOptimum(p).temperature;
    const r0max = thermalR0(p, tPeak)!;
    for (const t of scan(10, 40, 0.5)) expect(rvc(t)).toBeCloseTo((thermalR0(p, t)! / r0max) ** 2, 9);
    // 0.577 of the R0 peak at 25 °C (CHECK-VALUES) [derived]: 0.577² ≈ 0.333.
    expect(Math.sqrt(rvc(25))).toBeCloseTo(0.577, 3);
  });

  it('when 10 °C, then the EIP is not completed (no development below the PDR fit\'s T0 10.68 °C) instead of the 184 days extrapolated before', () => {
    expect(eipDays(p, 10)).toBeNull();
    expect(traitsAt(p, 10)).toMatchObject({ eipDays: null, eipNotCompleted: 'no-development', relativeVectorialCapacity: 0 });
    expect(eipDays(p, 10.7)).not.toBeNull();
  });

  it('when 25 °C, then the EIP is 1/PDR = 9.3 days [derived from the PDR Brière fit 6.56e-5, 10.68, 45.9]', () => {
    expect(eipDays(p, 25)).toBeCloseTo(1 / (6.56e-5 * 25 * (25 - 10.68) * Math.sqrt(45.9 - 25)), 9);
    expect(eipDays(p, 25)).toBeCloseTo(9.3, 1);
  });
});

describe('Anopheles / P. falciparum: Mordecai et al. 2013, Ecol. Lett. 16:22–30, Table 1 trait fits [pub, secondary transcription]', () => {
  const p = getProfile('anopheles-falciparum');
  const rvc = (t: number) => traitsAt(p, t).relativeVectorialCapacity;

  it('when 35 °C and 37 °C, then the relative vectorial capacity is 0 (was 0.65 and 0.28)', () => {
    expect(rvc(35)).toBe(0);
    expect(rvc(37)).toBe(0);
  });

  it('when their R0 is computed from the Table 1 fits, then it peaks near 25 °C and is positive from about 16 to about 34 °C, as the paper reports [pub]', () => {
    const s = support((t) => thermalR0(p, t)!);
    expect(Math.abs(s.peak - 25)).toBeLessThan(1);
    expect(Math.abs(s.lo - 16)).toBeLessThan(0.5); // 15.77: EFD −0.153T² + 8.61T − 97.7 = 0 [derived]
    expect(Math.abs(s.hi - 34)).toBeLessThan(0.5); // 33.71: pEA −0.00924T² + 0.453T − 4.77 = 0 [derived]
  });

  it('when the capacity is scanned, then it is zero wherever their R0 is zero: from 16 °C (the degree-day EIP threshold, Macdonald 1957) to 33.71 °C (pEA root) [derived]', () => {
    for (const t of scan(0, 50, 0.05)) if (thermalR0(p, t) === 0) expect(rvc(t)).toBe(0);
    const s = support(rvc);
    expect(s.lo).toBeGreaterThan(16); // just above the threshold pⁿ underflows to 0
    expect(s.lo).toBeLessThan(16.1);
    expect(s.hi).toBeCloseTo(33.71, 2);
  });

  it('when 34.4 °C or above, then P. falciparum has no EIP: the Tm of their parasite development rate fit', () => {
    expect(eipDays(p, 34.39)).not.toBeNull();
    expect(eipDays(p, 34.4)).toBeNull();
    expect(traitsAt(p, 36).eipNotCompleted).toBe('no-development');
  });
});

describe('Anopheles / P. vivax: vector limits of Mordecai et al. 2013, Table 1 [pub, secondary transcription]', () => {
  it('when 34 °C and above, then the capacity is 0: the fitted egg-to-adult survival is zero above 33.71 °C [derived]', () => {
    const p = getProfile('anopheles-vivax');
    for (const t of [33.72, 34, 35, 37, 40]) expect(traitsAt(p, t).relativeVectorialCapacity).toBe(0);
    expect(traitsAt(p, 33.5).relativeVectorialCapacity).toBeGreaterThan(0);
  });
});

describe('EIP that is not completed (Broodcast rule: survival through it below 1 % or longer than a year; common practice of this product)', () => {
  it('when the Culex / West Nile EIP (109 DD above 14.3 °C, Reisen, Fang & Martinez 2006) is taken just above its threshold, then it is "beyond-lifetime", not 10,900 days', () => {
    const p = getProfile('culex-wnv');
    expect(eipDays(p, 14.31)).toBeCloseTo(10_900, 0);
    expect(traitsAt(p, 14.31)).toMatchObject({ eipDays: null, eipNotCompleted: 'beyond-lifetime' });
    expect(traitsAt(p, 14)).toMatchObject({ eipDays: null, eipNotCompleted: 'no-development' });
    expect(traitsAt(p, 25).eipNotCompleted).toBeNull();
  });

  it('when any profile is scanned from −10 to 50 °C, then every EIP shown is at most a year and survived by at least 1 in 100 (property)', () => {
    for (const p of loadProfiles()) {
      for (const t of scan(-10, 50, 0.05)) {
        const x = traitsAt(p, t);
        if (x.eipDays === null) {
          expect(x.eipNotCompleted).not.toBeNull();
        } else {
          expect(x.eipDays).toBeLessThanOrEqual(EIP_MAX_DAYS);
          expect(x.survivalThroughEip).toBeGreaterThanOrEqual(EIP_MIN_SURVIVAL);
          expect(x.eipNotCompleted).toBeNull();
        }
      }
    }
  });

  it('when a plateau district stays near 14.3–14.6 °C for a season, then the Culex season shows no EIP above a year (the chart axis ran to ~1e19 days before)', () => {
    const p = getProfile('culex-wnv');
    const start = Date.parse('2024-06-01T00:00:00Z');
    const days: SeasonInputDay[] = Array.from({ length: 120 }, (_, i) => {
      const mean = 14.3 + 0.3 * Math.abs(Math.sin(i / 7)) + (i % 11 === 0 ? 1e-9 : 0);
      return { date: new Date(start + i * 86_400_000).toISOString().slice(0, 10), tmin: mean - 5, tmax: mean + 5, rh: 70 };
    });
    const out = computeSeason(p, { lat: 46, biofix: '2024-06-01' }, days);
    for (const d of out) {
      if (d.eipDays !== null) expect(d.eipDays).toBeLessThanOrEqual(EIP_MAX_DAYS);
      if (d.meanTemperature !== null) expect(d.eipDays !== null || d.eipNotCompleted !== null).toBe(true);
      for (const v of [d.ranges?.eipDays.low, d.ranges?.eipDays.high]) if (v !== null && v !== undefined) expect(v).toBeLessThanOrEqual(EIP_MAX_DAYS);
    }
    expect(out.filter((d) => d.eipNotCompleted === 'beyond-lifetime').length).toBeGreaterThan(0);
  });

  it('when the season path (trait table) and traitsAt (exact) are compared across temperatures, then they agree on whether the EIP completes except within a grid cell of a limit', () => {
    for (const p of loadProfiles()) {
      for (const t of scan(5, 40, 0.37)) {
        const exact = traitsAt(p, t);
        const start = '2024-07-01';
        const input: SeasonInputDay[] = Array.from({ length: 8 }, (_, i) => ({ date: `2024-07-0${i + 1}`, tmin: t, tmax: t, rh: 70 }));
        const day = computeSeason(p, { lat: 0, biofix: start }, input)[7];
        const near = [t - 0.01, t + 0.01].some((u) => (traitsAt(p, u).eipNotCompleted === null) !== (exact.eipNotCompleted === null));
        if (!near) expect(day.eipNotCompleted).toBe(exact.eipNotCompleted);
      }
    }
  });
});
