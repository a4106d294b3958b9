import type { Config } from '../server/config';
import { WeatherFeedService } from '../server/weather/weather-feed.service';
import { WeatherIntakeService } from '../server/weather/weather-intake.service';
import type { JobDef } from './job';

/** The scheduled pull of the station-data feed (off unless WEATHER_FEED_URL and WEATHER_FEED_CRON are set). */
export const weatherFeedJob = (config: Config): JobDef => ({
  name: 'weather-feed',
  cron: config.WEATHER_FEED_URL && config.WEATHER_FEED_CRON ? config.WEATHER_FEED_CRON : null,
  timezone: config.TIMEZONE,
  run: (ctx) => new WeatherFeedService(ctx).pull(null),
});

/** Marks failed the intakes whose process died mid-load (their heartbeat went stale). */
export const weatherSweepJob = (config: Config): JobDef => ({
  name: 'weather-upload-sweep',
  cron: config.WEATHER_SWEEP_CRON,
  timezone: config.TIMEZONE,
  run: (ctx) => new WeatherIntakeService(ctx).sweepStale(),
});

export const weatherJobs = (config: Config): JobDef[] => [weatherFeedJob(config), weatherSweepJob(config)];
