import { larvalSurveySchema, larvalSurveysSchema, type LarvalSurvey } from './schemas';

/**
 * Larval indices of Aedes surveys, WHO definitions (as in WHO 2009, "Dengue: guidelines for diagnosis,
 * treatment, prevention and control"; the Breteau index after Breteau 1954, Bull. World Health Organ.
 * 11:453–481 [memory for the page range]). The pupa index, pupae per 100 houses, is common practice
 * in pupal surveys (Focks & Chadee 1997, Am. J. Trop. Med. Hyg. 56:159–167 [memory]).
 * Each index is null where its denominator is zero, never NaN.
 */
export interface LarvalIndices {
  /** House index: % of houses inspected with larvae or pupae. */
  house: number | null;
  /** Container index: % of water-holding containers inspected that are positive. */
  container: number | null;
  /** Breteau index: positive containers per 100 houses inspected (can exceed 100). */
  breteau: number | null;
  /** Pupa index: pupae per 100 houses inspected; null when pupae were not counted. */
  pupa: number | null;
}

const per100 = (numerator: number, denominator: number): number | null =>
  denominator === 0 ? null : (100 * numerator) / denominator;

function indicesOf(s: LarvalSurvey): LarvalIndices {
  return {
    house: per100(s.housesPositive, s.housesInspected),
    container: per100(s.containersPositive, s.containersInspected),
    breteau: per100(s.containersPositive, s.housesInspected),
    // null and absent both mean "pupae not counted".
    pupa: s.pupae === undefined || s.pupae === null ? null : per100(s.pupae, s.housesInspected),
  };
}

/** The indices of one larval survey. Throws a ZodError when positives exceed inspected, etc. */
export function larvalIndices(survey: LarvalSurvey): LarvalIndices {
  return indicesOf(larvalSurveySchema.parse(survey));
}

/** The indices of several surveys, with how many surveys they pool and how many of them counted pupae. */
export interface PooledLarvalIndices extends LarvalIndices {
  surveys: number;
  /** Surveys that counted pupae: the pupa index is computed over these alone (null when none did). */
  pupaSurveys: number;
}

/**
 * The indices of several surveys together (e.g. one district-week): the counts are summed first and
 * the indices computed from the sums, so each house and container weighs the same, not each survey.
 * The pupa index pools only the surveys that counted pupae (their pupae per 100 of their houses
 * inspected, derived), so one survey without a pupa count does not blank the week; `pupaSurveys` says
 * how many surveys it rests on.
 */
export function aggregateLarvalIndices(surveys: readonly LarvalSurvey[]): PooledLarvalIndices {
  const all = larvalSurveysSchema.parse(surveys);
  const total = { housesInspected: 0, housesPositive: 0, containersInspected: 0, containersPositive: 0 };
  let pupae = 0;
  let pupaHouses = 0;
  let pupaSurveys = 0;
  for (const s of all) {
    total.housesInspected += s.housesInspected;
    total.housesPositive += s.housesPositive;
    total.containersInspected += s.containersInspected;
    total.containersPositive += s.containersPositive;
    if (s.pupae !== undefined && s.pupae !== null) {
      pupae += s.pupae;
      pupaHouses += s.housesInspected;
      pupaSurveys++;
    }
  }
  return {
    ...indicesOf(total),
    pupa: pupaSurveys === 0 ? null : per100(pupae, pupaHouses),
    surveys: all.length,
    pupaSurveys,
  };
}
