import { describe, expect, it } from 'vitest';
import {
  eipDays,
  getProfile,
  loadProfiles,
  parseProfile,
  profileSchema,
  thermalR0,
  traitsAt,
  vectorialCapacity,
  vectorialCapacityOptimum,
  compileProfile,
} from '../../shared/model';
import { TRAIT_COUNT, traitsFromTable } from '../../shared/model/traits';

describe('profiles: data validated by the schema', () => {
  it('when the shipped profiles load, then the five ids are there and each passes the schema', () => {
    expect(loadProfiles().map((p) => p.id).sort()).toEqual(['aedes-aegypti-dengue', 'aedes-albopictus-dengue', 'anopheles-falciparum', 'anopheles-vivax', 'culex-wnv']);
    for (const p of loadProfiles()) expect(profileSchema.safeParse(p).success).toBe(true);
  });
  it('when a parameter tagged "pub" loses its source, then the schema rejects it, naming the path', () => {
    const p = structuredClone(getProfile('anopheles-falciparum')) as Record<string, any>;
    delete p.eip.k.source;
    const r = profileSchema.safeParse(p);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path.join('.')).toBe('eip.k.source');
  });
  it('when low is above the value or the thresholds are crossed, then the schema rejects the profile', () => {
    const p = structuredClone(getProfile('culex-wnv')) as Record<string, any>;
    p.development.degreeDaysPerGeneration.low = 999;
    expect(() => parseProfile(p)).toThrow();
    const q = structuredClone(getProfile('culex-wnv')) as Record<string, any>;
    q.development.upperThreshold.value = 5;
    expect(profileSchema.safeParse(q).success).toBe(false);
  });
  it('when any numeric parameter is read, then it carries a tag, and a source unless "common practice"', () => {
    const walk = (x: unknown, path: string): void => {
      if (x && typeof x === 'object' && !Array.isArray(x)) {
        const o = x as Record<string, unknown>;
        if (typeof o.value === 'number' || typeof o.form === 'string') {
          expect(o.tag, path).toBeDefined();
          if (o.tag !== 'common practice') expect(o.source, path).toBeDefined();
        }
        for (const [k, v] of Object.entries(o)) if (k !== 'source') walk(v, `${path}.${k}`);
      }
    };
    for (const p of loadProfiles()) walk(p, p.id);
  });
});

describe('EIP by degree-days, n = K / (T − Tmin)', () => {
  it('when P. falciparum at 25 °C (K 111 above 16 °C; Macdonald 1957, Detinova 1962 WHO Monograph 47 [pub, secondary]), then 12.33 days [derived]', () => {
    expect(eipDays(getProfile('anopheles-falciparum'), 25)).toBeCloseTo(12.33, 2);
  });
  it('when P. vivax at 25 °C (K 105 above 14.5 °C [memory]), then 10 days [derived]', () => {
    expect(eipDays(getProfile('anopheles-vivax'), 25)).toBeCloseTo(10, 9);
  });
  it('when WNV in Culex tarsalis at 25 °C (about 109 DD above 14.3 °C; Reisen, Fang & Martinez 2006, J. Med. Entomol. 43:309–317 [pub, secondary]), then 10.19 days [derived]', () => {
    expect(eipDays(getProfile('culex-wnv'), 25)).toBeCloseTo(109 / 10.7, 9);
  });
  it('when the temperature is at or below the threshold, then there is no EIP (null)', () => {
    expect(eipDays(getProfile('anopheles-falciparum'), 16)).toBeNull();
  });
  it('when P. falciparum has its 18 °C threshold as the slow end (some later models [memory]), then the slow EIP at 25 °C is 111/7 days', () => {
    expect(eipDays(getProfile('anopheles-falciparum'), 25, 'slow')).toBeCloseTo(111 / 7, 9);
  });
});

describe('EIP of dengue: Chan & Johansson 2012, "The incubation periods of dengue viruses", PLoS ONE 7(11):e50972, abstract [pub]', () => {
  it('when Ae. albopictus at 25 °C and 30 °C, then the mean EIP is about 15 and 6.5 days (tolerance 15 %, as the abstract\'s rounded figures allow)', () => {
    // Ae. aegypti now takes its EIP from the Mordecai et al. 2017 PDR fit (see thermal-limits.test.ts).
    const p = getProfile('aedes-albopictus-dengue');
    expect(Math.abs(eipDays(p, 25)! / 15 - 1)).toBeLessThan(0.15);
    expect(Math.abs(eipDays(p, 30)! / 6.5 - 1)).toBeLessThan(0.15);
  });
});

describe('Anopheles traits', () => {
  const p = getProfile('anopheles-falciparum');
  it('when Martens 1997 survival (version of Craig et al. 1999) at 20, 25, 30 °C, then 0.9030, 0.9011, 0.8811 [derived]', () => {
    expect(traitsAt(p, 20).survival).toBeCloseTo(0.903, 4);
    expect(traitsAt(p, 25).survival).toBeCloseTo(0.9011, 4);
    expect(traitsAt(p, 30).survival).toBeCloseTo(0.8811, 4);
  });
  it('when the Detinova 1962 gonotrophic cycle U = 0.5 + 36.5/(T − 9.9) at 25 °C, then 2.92 days [pub, secondary / derived]', () => {
    expect(traitsAt(p, 25).gonotrophicCycleDays).toBeCloseTo(2.92, 2);
  });
  it('when the larval duration of Craig et al. 1999, 1/(0.00554 T − 0.06737), at 25 °C, then 14.06 days = K / (T − lower) [derived]', () => {
    const dev = p.development;
    expect(dev.degreeDaysPerGeneration.value / (25 - dev.lowerThreshold.value)).toBeCloseTo(14.06, 1);
  });
});

describe('Ae. aegypti traits: Mordecai et al. 2017, PLoS Negl. Trop. Dis. 11:e0005568, trait fits [pub, secondary transcription]', () => {
  const p = getProfile('aedes-aegypti-dengue');
  it('when 25 °C, then the biting rate is 0.2285 per day and the lifespan 29.84 days [derived]', () => {
    const t = traitsAt(p, 25);
    expect(t.bitingRate).toBeCloseTo(0.2285, 4);
    expect(t.lifespanDays).toBeCloseTo(29.84, 2);
    expect(t.survival).toBeCloseTo(Math.exp(-1 / 29.84), 4);
  });
  it('when the Mordecai-form R0 is scanned over temperature, then it peaks at 29.0 °C, is positive from about 17.1 to 34.6 °C and is 0.577 of its peak at 25 °C [derived]', () => {
    let best = 0;
    let bestT = 0;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i <= 4500; i++) {
      const t = i / 100;
      const r = thermalR0(p, t)!;
      if (r > best) {
        best = r;
        bestT = t;
      }
      if (r > 0) {
        lo = Math.min(lo, t);
        hi = Math.max(hi, t);
      }
    }
    expect(bestT).toBeCloseTo(29.0, 1);
    expect(lo).toBeCloseTo(17.1, 1);
    expect(hi).toBeCloseTo(34.6, 1);
    expect(thermalR0(p, 25)! / best).toBeCloseTo(0.577, 3);
  });
});

describe('vectorial capacity: Garrett-Jones 1964, Nature 204:1173–1175, C = m a² pⁿ / (−ln p)', () => {
  it('when m 10, a 0.3, p 0.9, n 10, then 2.978 [derived]', () => {
    expect(vectorialCapacity(10, 0.3, 0.9, 10)).toBeCloseTo(2.978, 3);
  });
  it('when any profile is scaled by its own optimum, then the relative capacity is 1 at the optimum and below 1 elsewhere', () => {
    for (const p of loadProfiles()) {
      const opt = vectorialCapacityOptimum(p);
      expect(traitsAt(p, opt.temperature).relativeVectorialCapacity).toBeCloseTo(1, 9);
      for (const t of [10, 15, 20, 25, 30, 35]) expect(traitsAt(p, t).relativeVectorialCapacity).toBeLessThanOrEqual(1 + 1e-12);
    }
  });
  it('when the optimum of the recalled Ae. albopictus fits is found, then it lies near 26 °C, as reported for Ae. albopictus [memory]', () => {
    expect(Math.abs(vectorialCapacityOptimum(getProfile('aedes-albopictus-dengue')).temperature - 26)).toBeLessThan(1);
  });
});

describe('trait table of the season path (linear interpolation on 0.01 °C)', () => {
  it('when the table is read anywhere from −10 to 50 °C, then it agrees with the exact functions within 2e-6 of each field\'s largest value', () => {
    const row = new Float64Array(TRAIT_COUNT);
    const exact = new Float64Array(TRAIT_COUNT);
    for (const p of loadProfiles()) {
      const cp = compileProfile(p);
      const max = new Float64Array(TRAIT_COUNT);
      for (let t = -10; t < 50; t += 0.05) {
        cp.evaluate(t, 1, exact);
        for (let j = 0; j < TRAIT_COUNT; j++) max[j] = Math.max(max[j], Math.abs(exact[j]));
      }
      let worst = 0;
      for (let t = -10; t < 50; t += 0.00737) {
        traitsFromTable(cp, t, 1, row);
        cp.evaluate(t, 1, exact);
        for (let j = 0; j < TRAIT_COUNT; j++) worst = Math.max(worst, Math.abs(row[j] - exact[j]) / max[j]);
      }
      expect(worst, p.id).toBeLessThanOrEqual(2e-6);
    }
  });
});
