import { afterEach, describe, expect, it } from 'vitest';
import { QueryClient, QueryClientProvider, useQuery } from '@tanstack/react-query';
import type { UploadDto } from '../../shared/api/weather.schema';
import { i18n } from '../../src/i18n';
import { UploadResult } from '../../src/features/weather/components/upload-result';
import { fakeApi, json } from './support/fake-api';
import { render, waitFor } from './support/render';

/** Issue 14 item 9: a weather file refused as a whole is shown as refused, with the reason in words, in every language. */
const refused: UploadDto = {
  id: '00000000-0000-4000-8000-000000000914', source: 'upload', fileName: 'stations.csv', status: 'refused', tempUnit: 'C', rainUnit: 'mm',
  bytesTotal: 5_000_000, bytesProcessed: 0, rowsProcessed: 0, rowsAccepted: 0, rowsFlagged: 0, rowsRejected: 0, rowsReplaced: 0, issueCount: 0,
  message: 'Line 2 of the file is longer than 65,536 bytes, the most Broodcast reads in one line. Nothing from it was saved.',
  reasonCode: 'line_too_long', reasonParams: { line: 2, limitBytes: 65536 },
  createdAt: '2026-03-10T10:00:00.000Z', finishedAt: '2026-03-10T10:00:00.100Z',
};

afterEach(async () => {
  await i18n.changeLanguage('en');
});

describe('a refused weather upload on the Intake screen', () => {
  const expected: Record<string, string[]> = {
    en: ['stations.csv — refused', 'The file was refused as a whole; nothing from it was saved.', 'Line 2 of the file is longer than 65,536 bytes'],
    fr: ['refusé', 'Le fichier a été refusé en entier', 'La ligne 2 dépasse 64 kB'],
    es: ['rechazado', 'El archivo se rechazó entero', 'La línea 2 supera 64 kB'],
    pt: ['recusado', 'O ficheiro foi recusado por inteiro', 'A linha 2 tem mais de 64 kB'],
  };
  for (const [language, texts] of Object.entries(expected)) {
    it(`when an upload was refused for a line too long and the interface is in ${language}, then the screen says refused and why, in ${language}`, async () => {
      await i18n.changeLanguage(language);
      fakeApi({ [`GET /api/weather/uploads/${refused.id}`]: () => json(200, refused) });
      const view = await render(
        <QueryClientProvider client={new QueryClient()}>
          <UploadResult initial={refused} />
        </QueryClientProvider>,
      );
      await waitFor(() => {
        for (const text of texts) expect(view.container.textContent?.replace(/\u202f|\u00a0/g, ' ')).toContain(text);
      });
    });
  }
});

describe('Recent intakes after an upload', () => {
  it('when an upload is shown and its checks end, then the list of recent intakes is fetched again (at once and with the counts)', async () => {
    // Issue 21: "Recent intakes" did not refresh after an upload.
    const processing: UploadDto = { ...refused, id: '00000000-0000-4000-8000-000000000915', status: 'processing', message: null, reasonCode: null, reasonParams: null, finishedAt: null };
    const done: UploadDto = { ...processing, status: 'done', rowsProcessed: 10, rowsAccepted: 10, finishedAt: '2026-03-10T10:00:01.000Z' };
    const client = new QueryClient();
    let listFetches = 0;
    client.setQueryDefaults(['weather', 'uploads'], { queryFn: async () => (listFetches++, { uploads: [] }) });
    fakeApi({ [`GET /api/weather/uploads/${processing.id}`]: () => json(200, done) });
    const Watcher = () => {
      useQuery({ queryKey: ['weather', 'uploads'] });
      return null;
    };
    await render(
      <QueryClientProvider client={client}>
        <Watcher />
        <UploadResult initial={processing} />
      </QueryClientProvider>,
    );
    await waitFor(() => expect(listFetches).toBeGreaterThanOrEqual(2));
  });
});
