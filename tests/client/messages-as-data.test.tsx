import { afterAll, describe, expect, it } from 'vitest';
import { signalNote, type SignalNote } from '../../shared/api/cases.schema';
import { i18n, setLanguage } from '../../src/i18n';
import { signalNoteText } from '../../src/features/cases/case-format';
import { formattersFor } from '../../src/i18n/format';
import { ApiError } from '../../src/lib/api-client';
import { errorText } from '../../src/lib/error-text';

/** Issue 15 (messages as data): the case signals' notes and the sign-in limit reach the client as codes and read in all four languages. */
const notes: SignalNote[] = [
  { code: 'channel-too-few-seasons', params: { seasons: 1 } },
  { code: 'channel-few-seasons', params: { seasons: 3, recommended: 5, most: 7 } },
  { code: 'channel-excluded-years', params: { years: [2022, 2024] } },
  { code: 'no-population', params: {} },
];

async function wordsIn(language: 'en' | 'fr' | 'es' | 'pt') {
  await setLanguage(language);
  await i18n.loadNamespaces(['cases']);
  const f = formattersFor(language);
  return notes.map((n) => signalNoteText(i18n.t, n, f.locale, (x) => f.number(x, 0, true)));
}

afterAll(async () => {
  await setLanguage('en');
});

describe('case-signal notes as codes', () => {
  it('when a note is checked with the shared contract, then only a known code with its parameters passes, never a sentence', () => {
    for (const n of notes) expect(signalNote.safeParse(n).success).toBe(true);
    expect(signalNote.safeParse('Fewer than two prior seasons are on record.').success).toBe(false);
    expect(signalNote.safeParse({ code: 'channel-excluded-years', params: {} }).success).toBe(false);
  });

  it('when the notes are worded in English, French, Spanish and Portuguese, then each is a whole sentence with its numbers', async () => {
    expect(await wordsIn('en')).toEqual([
      'Fewer than two prior seasons are on record: no endemic channel can be drawn.',
      'Only 3 prior seasons are on record (5 to 7 are recommended): read the channel as wide and unsteady.',
      'Left out of the channel as epidemic years: 2022 and 2024.',
      'No population is on record for this district: incidence per 100,000 cannot be given.',
    ]);
    const fr = await wordsIn('fr');
    expect(fr[0]).toBe('Moins de deux saisons antérieures sont enregistrées\u202f: aucun canal endémique ne peut être tracé.');
    expect(fr[2]).toBe('Exclues du canal comme années épidémiques\u202f: 2022 et 2024.');
    expect(fr[3]).toMatch(/^Aucune population .*100\u202f000 habitants/);
    const es = await wordsIn('es');
    expect(es[1]).toBe('Solo hay 3 temporadas anteriores registradas (se recomiendan de 5 a 7): lea el canal como amplio e inestable.');
    expect(es[2]).toBe('Excluidos del canal como años epidémicos: 2022 y 2024.');
    const pt = await wordsIn('pt');
    expect(pt[2]).toBe('Excluídos do canal como anos epidêmicos: 2022 e 2024.');
    for (const words of [fr, es, pt]) for (const w of words) expect(w).not.toMatch(/Fewer|Only|Left out|No population|district\.notes/);
  });

  it('when sign-in is refused for too many attempts, then the wait in minutes comes from the parameters and is worded in every language', async () => {
    const locked = (what: string, minutes: number) => new ApiError(429, 'too_many_attempts', 'Too many sign-in attempts; retry after 1 min.', [], { what, retryAfterMinutes: minutes });
    const said: Record<string, string[]> = {};
    for (const language of ['en', 'fr', 'es', 'pt'] as const) {
      await setLanguage(language);
      said[language] = [errorText(locked('sign-in', 1)), errorText(locked('sign-in', 15)), errorText(locked('password-reset', 15))];
    }
    expect(said.en).toEqual([
      'Too many sign-in attempts. Wait 1 minute, then try again.',
      'Too many sign-in attempts. Wait 15 minutes, then try again.',
      'Too many reset requests. Wait 15 minutes, then try again.',
    ]);
    expect(said.fr).toEqual([
      'Trop de tentatives de connexion. Patientez 1 minute, puis réessayez.',
      'Trop de tentatives de connexion. Patientez 15 minutes, puis réessayez.',
      'Trop de demandes de réinitialisation. Patientez 15 minutes, puis réessayez.',
    ]);
    expect(said.es[1]).toBe('Demasiados intentos de inicio de sesión. Espere 15 minutos e inténtelo de nuevo.');
    expect(said.pt[2]).toBe('Demasiados pedidos de redefinição. Aguarde 15 minutos e tente novamente.');
  });
});
