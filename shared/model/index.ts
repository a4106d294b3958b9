/**
 * Broodcast season model: pure functions, no I/O. Used alike by the server, the scheduled season run,
 * the command line and the browser. See docs/model.md for every formula and its source.
 */
export {
  degreeDays,
  degreeDaysFast,
  isDoubleMethod,
  sineExcess,
  sineShareAbove,
  triangleExcess,
  triangleShareAbove,
  DEGREE_DAY_METHODS,
  CUTOFFS,
  METHOD_CODE,
  CUTOFF_CODE,
} from './degree-days';
export type { DegreeDayMethod, Cutoff, DegreeDayInput, DegreeDayResult } from './degree-days';

export { accumulate } from './accumulate';
export type { AccumulateInputDay, AccumulatedDay } from './accumulate';

export { dayLength, dayLengthFast, definitionAngle, DAY_LENGTH_DEFINITIONS } from './day-length';
export type { DayLengthDefinition, DayLengthOptions } from './day-length';

export {
  saturationVapourPressure,
  saturationVapourPressureFao56,
  dewPoint,
  relativeHumidityFromDewPoint,
  vapourPressureDeficit,
  MAGNUS,
} from './humidity';

export { epiWeek, epiWeekStart, epiWeekEnd, weeksInYear, weekOneStart, epiWeekOfDay, EPI_WEEK_SYSTEMS } from './epi-week';
export type { EpiWeek, EpiWeekSystem } from './epi-week';

export { parseIsoDate, formatIsoDate, isIsoDate, isLeapYear, dayOfYear, weekday } from './dates';

export {
  profileSchema,
  parseProfile,
  sourceSchema,
  pointParamSchema,
  rangedParamSchema,
  thermalCurveSchema,
  PROVENANCE_TAGS,
} from './profile.schema';
export type { Profile, ProfileInput, Source, PointParam, RangedParam, ThermalCurve, ProvenanceTag } from './profile.schema';

export { profiles, loadProfiles, getProfile, findProfile, PROFILE_IDS } from './profiles';

export {
  compileProfile,
  traitsAt,
  eipDays,
  vectorialCapacity,
  vectorialCapacityOptimum,
  thermalR0,
  briere,
  quadratic,
  curveFunction,
  OPTIMUM_GRID,
} from './traits';
export type { CompiledProfile, TraitsAt, VariantName } from './traits';

export { computeSeason, computeSeasonColumns, createSeasonColumns, defaultBiofix } from './season';
export type { SeasonOptions, SeasonColumns, SeasonColumnsInput, SeasonInputDay, SeasonDay, Range } from './season';
