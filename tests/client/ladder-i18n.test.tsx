import { afterEach, describe, expect, it, vi } from 'vitest';
import { MemoryRouter } from 'react-router-dom';
import { boardResponse, districtFileResponse } from '../../shared/api/board.schema';
import { LadderTable, ladderCsv } from '../../src/features/ladder/components/ladder.table';
import { currentLadderWords } from '../../src/features/ladder/ladder-format';
import { WeatherChart } from '../../src/features/district-file/charts/weather.chart';
import { DegreeDaysChart } from '../../src/features/district-file/charts/vector-clock.charts';
import { KeyNumbers } from '../../src/features/district-file/components/key-numbers';
import { tierNotes } from '../../src/features/district-file/district-file-format';
import { i18n } from '../../src/i18n';
import { UnitsContext, unitsFor } from '../../src/lib/units';
import { demoBoard, demoDistrictFile, ladderRow } from './support/board-fixtures';
import { click, getButton, render, type Rendered } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));

let view: Rendered | undefined;
afterEach(async () => {
  view?.unmount();
  view = undefined;
  await i18n.changeLanguage('en');
});

const NNBSP = '\u202f'; // French groups thousands with a narrow no-break space

describe('the Ladder in French', () => {
  it('when the interface is French, then the headers, tiers, drivers and zones are French and numbers and dates use the French format', async () => {
    await i18n.changeLanguage('fr');
    const rows = boardResponse.parse({
      ...demoBoard,
      rows: [...demoBoard.rows, ladderRow(5, { name: 'Vell Marsh', code: 'HV-05', rank: 5, casesThisWeek: 1234, score: 0.04 })],
    }).rows;
    view = await render(
      <MemoryRouter>
        <LadderTable rows={rows} caption="Le Classement" />
      </MemoryRouter>,
    );
    const c = view.container;
    const headers = [...c.querySelectorAll('thead th button.sort-button')].map((b) => b.firstChild?.textContent);
    expect(headers).toEqual(['Rang', 'District', 'Niveau', 'Depuis la semaine dernière', 'Facteur principal', 'Cas (dernière semaine complète)', 'Canal', 'Météo la plus récente']);
    const first = c.querySelector('tr[data-district="HV-01"]')!;
    expect(first.textContent).toContain('Critique');
    expect(first.textContent).toContain('score 0,81');
    expect(first.textContent).toContain('fourchette Élevé–Critique');
    expect(first.textContent).toContain('Signal des cas');
    expect(first.textContent).toContain('Au-dessus du canal');
    expect(first.textContent).toContain('en hausse de 1');
    expect(c.querySelector('tr[data-district="HV-02"]')!.textContent).toContain('données anciennes');
    expect(c.querySelector('tr[data-district="HV-05"]')!.textContent).toContain(`1${NNBSP}234`);
    expect(c.querySelector('tr[data-district="HV-05"]')!.textContent).toContain('1 juin 2025');
    expect(c.textContent).toContain('5 districts');
    expect(c.querySelector('label')?.textContent).toBe('Filtrer les districts');
    expect(c.querySelector('button.help-button')?.getAttribute('aria-label')).toBe('À propos : Niveau et score');

    // The CSV speaks French too (its numbers stay machine-readable).
    const csv = ladderCsv(
      rows.map((r) => ({ original: r }) as never),
      [{ id: 'district', columnDef: { meta: { label: 'District', csv: (r) => r.name } } }, { id: 'tier', columnDef: { meta: { label: 'Niveau', csv: (r) => r.tier } } }],
      currentLadderWords(),
    ).split('\r\n');
    expect(csv[0]).toBe('District,Code,Niveau,Score,Fourchette de niveaux,Fiabilité');
    expect(csv[1]).toBe('Saltmarsh Coast,HV-01,critical,0.81,Élevé–Critique,ok');
  });

  it('when the interface is Spanish or Portuguese, then the Ladder uses the agreed screen words', async () => {
    for (const [lng, tier, zone] of [
      ['es', 'Crítico', 'Sobre el canal'],
      ['pt', 'Crítico', 'Acima do canal'],
    ] as const) {
      await i18n.changeLanguage(lng);
      view = await render(
        <MemoryRouter>
          <LadderTable rows={boardResponse.parse(demoBoard).rows} caption="x" />
        </MemoryRouter>,
      );
      const first = view.container.querySelector('tr[data-district="HV-01"]')!;
      expect(first.textContent).toContain(tier);
      expect(first.textContent).toContain(zone);
      expect(first.textContent).toContain('0,81');
      view.unmount();
      view = undefined;
    }
  });

  it('when the stored notes are English sentences, then the District file rebuilds them in the interface language', async () => {
    await i18n.changeLanguage('fr');
    const tier = districtFileResponse.parse(demoDistrictFile()).tiers[1];
    const notes = tierNotes(currentLadderWords(), {
      ...tier,
      notes: ['The newest weather is 5 days old.', 'Larval indices: no data; its weight is shared among the others.', 'Something new from the server.'],
      drivers: tier.drivers.map((d) => (d.id === 'larval' ? { ...d, score: null } : d)),
    });
    expect(notes).toEqual(['La météo la plus récente date de 5 jours.', 'Indices larvaires : pas de données ; son poids est réparti entre les autres.', 'Something new from the server.']);
  });
});

describe('display units on the District file', () => {
  const file = districtFileResponse.parse(demoDistrictFile());
  const fahrenheit = unitsFor({ temperature: 'F', rain: 'in' });

  it('when the user’s units are °F and inches, then the weather chart, its table and its legend use them (stored values stay °C and mm)', async () => {
    view = await render(
      <UnitsContext value={fahrenheit}>
        <WeatherChart weather={file.weather} />
      </UnitsContext>,
    );
    const c = view.container;
    expect(c.textContent).toContain('(°F, left scale)');
    expect(c.textContent).toContain('The warmest day reached 91.2 °F on 20 May 2025.');
    const series = JSON.parse(c.querySelector('[data-testid="echart-stub"]')!.getAttribute('data-series')!);
    expect(series).toEqual(['Maximum °F', 'Minimum °F', 'Relative humidity %', 'Rain in']);
    await click(getButton(c, 'Show as table'));
    const header = [...c.querySelectorAll('thead th')].map((th) => th.textContent);
    expect(header).toEqual(['Day', 'Minimum °F', 'Maximum °F', 'Relative humidity %', 'Rain in', 'Filled in']);
    const first = [...c.querySelectorAll('tbody tr')][0].children;
    // 22 °C = 71.6 °F, 31 °C = 87.8 °F, 4 mm = 0.16 in.
    expect([...first].map((x) => x.textContent)).toEqual(['1 May 2025', '71.6', '87.8', '70', '0.16', '—']);
  });

  it('when the user’s units are °F, then degree-days are shown in °F·d (a difference: × 9/5, no offset)', async () => {
    view = await render(
      <UnitsContext value={fahrenheit}>
        <DegreeDaysChart vc={file.vectorClock[0]} seasonYear={2025} />
        <KeyNumbers data={file} />
      </UnitsContext>,
    );
    const c = view.container;
    // 285 °C·d × 9/5 = 513 °F·d.
    expect(c.textContent).toContain('reached 513 °F·d by 20 May 2025');
    expect(c.querySelector('[data-key-number="degreeDays"]')?.textContent).toContain('513 °F·d');
    // The freshest day: 23.9 °C = 75.0 °F, 32.9 °C = 91.2 °F.
    expect(c.querySelector('[data-key-number="weather"]')?.textContent).toContain('min 75 / max 91.2 °F');
  });
});
