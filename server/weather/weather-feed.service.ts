import { Readable } from 'node:stream';
import type { AppContext } from '../app-context';
import { conflict } from '../http/errors';
import { csvStreamSource, type IntakeSource, recordsSource, WeatherIntakeService } from './weather-intake.service';

const HEADER = ['station', 'date', 'tmin', 'tmax', 'rh', 'dewpoint', 'rain'];
const cell = (v: unknown) => (v === null || v === undefined ? '' : String(v));

/**
 * The scheduled pull from the configured station-data feed. The answer is JSON (`{"units"?, "rows": [...]}`
 * or a bare array of rows with station, date, tmin, tmax, rh or dewpoint, rain) or CSV with the upload
 * header; either way it becomes records for the same intake pipeline as an upload.
 */
export class WeatherFeedService {
  private readonly intake: WeatherIntakeService;
  constructor(private readonly ctx: AppContext) {
    this.intake = new WeatherIntakeService(ctx);
  }

  async pull(actorId: string | null): Promise<string> {
    const { WEATHER_FEED_URL: url, WEATHER_FEED_KEY: key } = this.ctx.config;
    if (!url) throw conflict('feed_not_configured', 'No weather feed is configured (set WEATHER_FEED_URL).');
    let units = { temperature: 'C' as 'C' | 'F', rain: 'mm' as 'mm' | 'in' };
    let source: IntakeSource | null = null;
    let problem: string | null = null;
    try {
      const res = await fetch(url, {
        headers: { accept: 'application/json, text/csv', ...(key ? { authorization: `Bearer ${key}` } : {}) },
        signal: AbortSignal.timeout(60_000),
      });
      const type = res.headers.get('content-type') ?? '';
      if (!res.ok) {
        await res.body?.cancel();
        problem = `The feed answered HTTP ${res.status}${res.status === 401 || res.status === 403 ? ' (check WEATHER_FEED_KEY)' : ''}. Nothing was loaded.`;
      } else if (type.includes('json')) {
        const body = (await res.json()) as unknown;
        const obj = (Array.isArray(body) ? { rows: body } : body) as { rows?: unknown; units?: { temperature?: string; rain?: string } };
        if (!Array.isArray(obj?.rows)) problem = 'The feed\'s JSON has no "rows" list. Nothing was loaded.';
        else {
          if (obj.units?.temperature === 'F') units.temperature = 'F';
          if (obj.units?.rain === 'in') units.rain = 'in';
          const rows = (obj.rows as Record<string, unknown>[]).map((r) =>
            r && typeof r === 'object' ? HEADER.map((h) => cell(r[h])) : ['', '', '', '', '', '', '']);
          source = recordsSource(HEADER, rows);
        }
      } else if (res.body) {
        source = csvStreamSource(Readable.fromWeb(res.body as never));
      } else problem = 'The feed sent an empty answer. Nothing was loaded.';
    } catch (err) {
      problem = `The feed could not be reached (${(err as Error).message}). Nothing was loaded.`;
    }
    const upload = await this.intake.start({
      source: 'feed', fileName: new URL(url).host + new URL(url).pathname, tempUnit: units.temperature, rainUnit: units.rain, bytesTotal: 0, actorId,
    });
    if (problem || !source) {
      await this.ctx.ds.query(`UPDATE weather_uploads SET status = 'failed', message = $2, finished_at = now() WHERE id = $1`, [upload.id, problem]);
    } else await this.intake.run(upload, source);
    return upload.id;
  }
}
