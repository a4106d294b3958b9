import { describe, expect, it } from 'vitest';
import { CHANNEL_ZONES, channelZone, endemicChannel } from '../../shared/signals';

describe('endemicChannel — geometric (Bortman 1999, Rev. Panam. Salud Pública 5(1):1–8)', () => {
  it('when the history is 3, 7, 15, 1, 7, then the band is the hand-computed one with t(4) = 2.776 [derived]', () => {
    // x + 1 = 4, 8, 16, 2, 8 = 2^k with k = 2, 3, 4, 1, 3, so y = ln(x + 1) = k·ln 2 and the
    // arithmetic can be done in powers of two:
    //   mean k = 13/5 = 2.6                   → centre = 2^2.6 − 1 = 6.062866 − 1 = 5.062866
    //   deviations −0.6, 0.4, 1.4, −1.6, 0.4; squares sum 5.2; /(n − 1) = 1.3; SD_k = 1.140175
    //   t on 4 df (two-sided 95 %) = 2.776445 (NIST/SEMATECH e-Handbook §1.3.6.7.2: 2.776)
    //   half-width in k = 2.776445 · 1.140175 / √5 = 1.415715
    //   lower = 2^(2.6 − 1.415715) − 1 = 2^1.184285 − 1 = 2.272508 − 1 = 1.272508
    //   upper = 2^(2.6 + 1.415715) − 1 = 2^4.015715 − 1 = 16.175235 − 1 = 15.175235
    const band = endemicChannel('geometric', [3, 7, 15, 1, 7]);
    expect(band.centre).toBeCloseTo(5.062866, 5);
    expect(band.lower).toBeCloseTo(1.272508, 5);
    expect(band.upper).toBeCloseTo(15.175235, 5);
  });

  it('when the level is 90 %, then the band narrows with t(4) = 2.132 [derived]', () => {
    // half-width in k = 2.131847 · 1.140175 / √5 = 1.087045; lower = 2^1.512955 − 1 = 1.853964,
    // upper = 2^3.687045 − 1 = 12.879751 − 1 = 11.879751
    const band = endemicChannel('geometric', [3, 7, 15, 1, 7], { level: 0.9 });
    expect(band.lower).toBeCloseTo(1.853964, 5);
    expect(band.upper).toBeCloseTo(11.879751, 5);
  });

  it('when every prior season had zero cases, then lower, centre and upper are all 0 [derived]', () => {
    // y = ln 1 = 0 in every season: mean 0, SD 0, so e^0 − 1 = 0 for all three.
    expect(endemicChannel('geometric', [0, 0, 0, 0, 0])).toEqual({ lower: 0, centre: 0, upper: 0 });
  });

  it('when e^(ȳ − t·s/√n) − 1 is negative, then the lower bound is floored at 0 (product rule)', () => {
    // y = 0, 0, 0, 0, ln 51: ȳ = 0.786365, s = 1.758366, half-width = 2.776445·1.758366/√5 = 2.183300,
    // e^(0.786365 − 2.183300) − 1 = −0.7526 → floored at 0 [derived]
    const band = endemicChannel('geometric', [0, 0, 0, 0, 50]);
    expect(band.lower).toBe(0);
    expect(band.centre).toBeCloseTo(Math.exp(Math.log(51) / 5) - 1, 10);
  });
});

describe('endemicChannel — quartile (type 7, Hyndman & Fan 1996, The American Statistician 50:361–365)', () => {
  it('when the history is 10, 20, 15, 30, 25, 12, then Q1, median, Q3 are 12.75, 17.5, 23.75 [derived]', () => {
    // sorted 10, 12, 15, 20, 25, 30 (n = 6); h = (n − 1)·p:
    //   p 0.25 → h 1.25 → 12 + 0.25·(15 − 12) = 12.75
    //   p 0.50 → h 2.50 → 15 + 0.50·(20 − 15) = 17.5
    //   p 0.75 → h 3.75 → 20 + 0.75·(25 − 20) = 23.75
    expect(endemicChannel('quartile', [10, 20, 15, 30, 25, 12])).toEqual({ lower: 12.75, centre: 17.5, upper: 23.75 });
  });

  it('when n is odd and (n − 1)·p is whole, then the quartiles are order statistics [derived]', () => {
    // sorted 1, 2, 4, 8, 16 (n = 5): h = 1, 2, 3 → 2, 4, 8
    expect(endemicChannel('quartile', [8, 1, 16, 4, 2])).toEqual({ lower: 2, centre: 4, upper: 8 });
  });
});

describe('endemicChannel — mean ± 2 SD (sample SD; common practice)', () => {
  it('when the history is 10, 20, 15, 30, 25, then the band is 20 ∓ 2·7.9057 [derived]', () => {
    // mean 20; deviations −10, 0, −5, 10, 5; squares 250; /4 = 62.5; SD = 7.905694
    // lower 20 − 15.811388 = 4.188612, upper 35.811388
    const band = endemicChannel('mean-2sd', [10, 20, 15, 30, 25]);
    expect(band.centre).toBe(20);
    expect(band.lower).toBeCloseTo(4.188612, 5);
    expect(band.upper).toBeCloseTo(35.811388, 5);
  });

  it('when mean − 2 SD is negative, then the lower bound is 0 [derived]', () => {
    // 0, 0, 0, 0, 10: mean 2, SD √(80/4) = 4.472136, 2 − 8.944272 < 0 → 0; upper 10.944272
    const band = endemicChannel('mean-2sd', [0, 0, 0, 0, 10]);
    expect(band.lower).toBe(0);
    expect(band.upper).toBeCloseTo(10.944272, 5);
  });
});

describe('endemicChannel — input checks', () => {
  it('when the history has fewer than two seasons, a negative or a non-finite value, then it throws', () => {
    expect(() => endemicChannel('geometric', [4])).toThrow();
    expect(() => endemicChannel('quartile', [4, -1, 3])).toThrow();
    expect(() => endemicChannel('mean-2sd', [4, Number.NaN, 3])).toThrow();
    expect(() => endemicChannel('median' as never, [1, 2, 3])).toThrow();
  });
});

describe('channelZone (Broodcast zone names)', () => {
  const band = { lower: 2, centre: 5, upper: 9 };

  it('when a count is under the lower bound, on a bound or over the upper bound, then it is below, within or above', () => {
    expect(channelZone(1, band)).toBe('below');
    expect(channelZone(2, band)).toBe('within');
    expect(channelZone(9, band)).toBe('within');
    expect(channelZone(10, band)).toBe('above');
  });

  it('when the zones are listed, then they carry Broodcast ids and labels in order', () => {
    expect(CHANNEL_ZONES).toEqual([
      { id: 'below', label: 'Below the channel' },
      { id: 'within', label: 'Within the channel' },
      { id: 'above', label: 'Above the channel' },
    ]);
  });
});
