/**
 * A tiny local station-data feed for the demo and the tests (loopback only): the demo stations' recent
 * days, as JSON (`GET /recent`) or CSV (`GET /recent?format=csv`), from the same seeded generator as the
 * demo weather. It answers 401 without `Authorization: Bearer <key>`. Invented data, nothing real.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { dayOfIsoDate, isoOfDay } from '../shared/weather/qc';
import { demoWeather, yesterday } from './demo-weather';

export const FAKE_FEED_PATH = '/recent';

export async function startFakeFeed(opts: { port: number; key: string; days?: number; host?: string }): Promise<{ url: string; stop(): Promise<void>; server: Server }> {
  const server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://feed.invalid');
    if (url.pathname !== FAKE_FEED_PATH) {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
      return;
    }
    if (req.headers.authorization !== `Bearer ${opts.key}`) {
      res.writeHead(401, { 'content-type': 'text/plain' }).end('a feed key is required');
      return;
    }
    const days = Math.min(60, Math.max(1, Number(url.searchParams.get('days') ?? opts.days ?? 7)));
    const to = yesterday();
    const rows = demoWeather(isoOfDay(dayOfIsoDate(to) - days + 1), to);
    if (url.searchParams.get('format') === 'csv') {
      res.writeHead(200, { 'content-type': 'text/csv; charset=utf-8' });
      res.end('station,date,tmin,tmax,rh,rain\n' + rows.map((r) => `${r.station},${r.date},${r.tmin},${r.tmax},${r.rh},${r.rain}`).join('\n') + '\n');
      return;
    }
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end(JSON.stringify({ units: { temperature: 'C', rain: 'mm' }, rows }));
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, opts.host ?? '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  return {
    server,
    url: `http://127.0.0.1:${port}${FAKE_FEED_PATH}`,
    stop: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
