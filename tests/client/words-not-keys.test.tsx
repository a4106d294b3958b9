import { afterAll, describe, expect, it } from 'vitest';
import { i18n, setLanguage } from '../../src/i18n';
import { formattersFor } from '../../src/i18n/format';
import { issueReason } from '../../src/features/weather/weather-units';
import { parameterOption } from '../../src/features/profiles/parameter-words';
import { monthDayText } from '../../src/features/profiles/components/profile-assignment';
import type { IssueDto } from '../../shared/api/weather.schema';
import type { Units } from '../../src/lib/units';

/** Issue 21: what the server measured reaches the screen as figures worded in the interface language, never as its English sentence. */
const celsius = {
  toTemperature: (c: number) => c, toTemperatureDelta: (c: number) => c, temperatureSymbol: '°C',
  toRain: (mm: number) => mm, rainSymbol: 'mm', rainDigits: 1,
} as unknown as Units;

const jump: IssueDto = {
  rowNumber: 4, station: 'HVS-01', date: '2026-06-03', column: 'tmax', value: '32.5', severity: 'flagged', rule: 'jump',
  reason: 'Tmin 22.5 → 45.25, Tmax 31 → 55 °C from the day before (limit 15 °C).',
  params: { ptmin: 22.5, tmin: 45.25, ptmax: 31, tmax: 55, limit: 15 },
} as IssueDto;

afterAll(async () => {
  await setLanguage('en');
});

describe('server figures worded by the client', () => {
  it('when a jump line is shown in French, then it is French with decimal commas and no English sentence', async () => {
    await setLanguage('fr');
    await i18n.loadNamespaces(['weather']);
    const { text, detail } = issueReason(jump, celsius, formattersFor('fr'), i18n.getFixedT('fr', 'weather'), 'fr');
    expect(detail).toBeNull();
    expect(text).toContain('22,5 °C → 45,3 °C');
    expect(text).toContain('limite 15 °C');
    expect(text).not.toMatch(/from the day before|\d\.\d/);
  });

  it('when a jump line is shown in Portuguese and °F, then the limit is a difference in °F (scaled, not shifted)', async () => {
    await setLanguage('pt');
    await i18n.loadNamespaces(['weather']);
    const f = { ...celsius, toTemperature: (c: number) => c * 1.8 + 32, toTemperatureDelta: (c: number) => c * 1.8, temperatureSymbol: '°F' } as Units;
    const { text } = issueReason(jump, f, formattersFor('pt'), i18n.getFixedT('pt', 'weather'), 'pt');
    expect(text).toContain('limite 27 °F');
    expect(text).toContain('72,5 °F');
  });

  it('when a line of an older intake has no figures, then its sentence is still shown under the rule', async () => {
    await setLanguage('fr');
    const { detail } = issueReason({ ...jump, params: null }, celsius, formattersFor('fr'), i18n.getFixedT('fr', 'weather'), 'fr');
    expect(detail).toContain('Tmin 22.5');
  });

  it('when the variant form lists parameters in Spanish, then each is a worded name with a translated unit, not an internal key', async () => {
    await setLanguage('es');
    await i18n.loadNamespaces(['profiles']);
    const t = i18n.getFixedT('es', 'profiles');
    const text = parameterOption(t, formattersFor('es'), { path: 'development.degreeDaysPerGeneration', value: 135.2, unit: 'degree-days' });
    expect(text).toBe('Grados-día por generación (135,2 grados-día)');
    expect(parameterOption(t, formattersFor('es'), { path: 'eip.slope', value: -0.05, unit: 'ln(days) per °C' })).not.toMatch(/eip|days/);
  });

  it('when a biofix MM-DD is shown, then it reads as the language writes a day and month', () => {
    expect(monthDayText('06-01', 'fr-FR')).toBe('1 juin');
    expect(monthDayText('06-01', 'en-GB')).toBe('1 June');
    expect(monthDayText('bad', 'fr-FR')).toBe('bad');
  });
});
