import { describe, expect, it } from 'vitest';
import { dewPoint, relativeHumidityFromDewPoint, saturationVapourPressure, saturationVapourPressureFao56, vapourPressureDeficit } from '../../shared/model';

describe('humidity: Magnus form, Alduchov & Eskridge 1996, J. Appl. Meteorol. 35:601–609', () => {
  it('when 20 °C and 25 °C, then 23.33 and 31.62 hPa [derived], within 0.1 hPa of the standard tables 23.39 / 31.69', () => {
    expect(saturationVapourPressure(20)).toBeCloseTo(23.33, 2);
    expect(saturationVapourPressure(25)).toBeCloseTo(31.62, 2);
    expect(Math.abs(saturationVapourPressure(20) - 23.39)).toBeLessThan(0.1);
    expect(Math.abs(saturationVapourPressure(25) - 31.69)).toBeLessThan(0.1);
  });
  it('when the dew point is computed from RH and RH back from the dew point, then RH round-trips [derived]', () => {
    for (const [t, rh] of [[25, 60], [10, 95], [35, 20]]) {
      const td = dewPoint(t, rh);
      expect(relativeHumidityFromDewPoint(t, td)).toBeCloseTo(rh, 9);
    }
    expect(dewPoint(20, 100)).toBeCloseTo(20, 9);
  });
  it('when 25 °C and 60 % RH, then the vapour pressure deficit is 40 % of es(25) [derived]', () => {
    expect(vapourPressureDeficit(25, 60)).toBeCloseTo(0.4 * saturationVapourPressure(25), 12);
  });
});

describe('humidity: FAO-56 eq. 11, Allen, Pereira, Raes & Smith 1998, FAO Irrigation and Drainage Paper 56, worked example [pub]', () => {
  it('when 24.5 °C and 15 °C, then 3.075 and 1.705 kPa', () => {
    expect(saturationVapourPressureFao56(24.5)).toBeCloseTo(3.075, 3);
    expect(saturationVapourPressureFao56(15)).toBeCloseTo(1.705, 3);
  });
});
