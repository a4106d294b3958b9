/**
 * Case-signal and larval-index statistics: pure functions, no I/O (docs/signals.md).
 * Every function validates its input with the schemas in ./schemas and throws a ZodError on bad input.
 */
export * from './schemas';
export { mean, sampleSd, quantileType7 } from './descriptive';
export { studentTTwoSided } from './student-t';
export {
  endemicChannel,
  channelZone,
  CHANNEL_ZONES,
  CHANNEL_ZONE_LABELS,
  type ChannelBand,
  type ChannelOptions,
} from './endemic-channel';
export {
  aberration,
  c1,
  c2,
  c3,
  summariseBaseline,
  BASELINE_WEEKS,
  C2_GAP_WEEKS,
  C1_C2_ALARM,
  C3_ALARM,
  type AberrationOptions,
  type BaselineSummary,
  type SignalSeries,
} from './aberration';
export { cusum } from './cusum';
export {
  weekOnWeekGrowth,
  growthSeries,
  doublingTime,
  logLinearGrowth,
  type WeekGrowth,
  type FittedGrowth,
} from './growth';
export { incidencePer100k } from './incidence';
export { larvalIndices, aggregateLarvalIndices, type LarvalIndices, type PooledLarvalIndices } from './larval-indices';
