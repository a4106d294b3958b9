/**
 * The numbers that explain themselves on demand (the "?" beside them on the Ladder, the District file and
 * the printable page). The words of each topic — what it is, how it was computed, its caution — are in the
 * `help` namespace (`topics.<id>.*`, all four languages). The sources are bibliographic references and
 * stay as published, in one place here; each is taken from docs/model.md, docs/signals.md or docs/tier.md
 * (no other source is cited). A topic without a published method says so (`ownRule`).
 */
export const HELP_TOPICS = [
  'tier',
  'tierRange',
  'confidence',
  'change',
  'leadingDriver',
  'driverScore',
  'weight',
  'contribution',
  'climate',
  'vectorClockDriver',
  'larvalDriver',
  'caseSignal',
  'casesThisWeek',
  'channelZone',
  'latestWeather',
  'degreeDays',
  'generations',
  'eip',
  'survivalEip',
  'rvc',
  'seasonWindow',
  'larvalIndices',
] as const;
export type HelpTopic = (typeof HELP_TOPICS)[number];

const TIER_DOC = 'Broodcast, docs/tier.md: “The tier, its drivers and the season run”.';
const BORTMAN = 'Bortman M. 1999. Elaboración de corredores o canales endémicos mediante planillas de cálculo. Rev. Panam. Salud Pública 5(1):1–8.';
const HUTWAGNER = 'Hutwagner L, Thompson W, Seeman GM, Treadwell T. 2003. J. Urban Health 80(Suppl 1):i89–i96 (aberration tests C1, C2, C3).';
const GARRETT_JONES = 'Garrett-Jones 1964. Nature 204:1173–1175 (vectorial capacity, C = m a² pⁿ / (−ln p)).';
const WHO_2009 = 'WHO 2009. Dengue: guidelines for diagnosis, treatment, prevention and control (larval indices).';
const BRETEAU = 'Breteau H. 1954. Bull. World Health Organ. 11:453–481 [recalled, to be checked].';
const MCMASTER = 'McMaster & Wilhelm 1997. Growing degree-days: one equation, two interpretations. Agric. For. Meteorol. 87:291–300.';
const BASKERVILLE = 'Baskerville & Emin 1969. Ecology 50:514–517 (single sine, the default method).';
const ZALOM = 'Zalom, Goodell, Wilson, Barnett & Bentley 1983. UC DANR Leaflet 21373 (methods and cutoffs).';
const MORDECAI = 'Mordecai et al. 2017. PLoS Negl. Trop. Dis. 11:e0005568 (Aedes development, biting and lifespan).';
const CRAIG = 'Craig, Snow & le Sueur 1999. Parasitology Today 15:105–111 (Anopheles development).';
const CHAN = 'Chan & Johansson 2012. PLoS ONE 7(11):e50972 (dengue EIP in Aedes).';
const REISEN = 'Reisen, Fang & Martinez 2006. J. Med. Entomol. 43:309–317 (West Nile virus EIP in Culex).';
const MACDONALD = 'Macdonald 1957; Detinova 1962, WHO Monograph 47 (malaria EIP and gonotrophic cycle in Anopheles).';
const MARTENS = 'Martens 1997, as used by Craig et al. 1999 (Anopheles daily survival).';
const FORSYTHE = 'Forsythe, Rykiel, Stahl, Wu & Schoolfield 1995. A model comparison for daylength as a function of latitude and day of year. Ecological Modelling 80:87–95.';
const SPIELMAN = 'Spielman & Wong 1973. Ann. Entomol. Soc. Am. 66:905–907 (Culex critical photoperiod) [recalled, to be checked].';

/** The published sources behind each topic, as written in the method notes. */
export const HELP_SOURCES: Record<HelpTopic, readonly string[]> = {
  tier: [TIER_DOC],
  tierRange: [TIER_DOC],
  confidence: [TIER_DOC],
  change: [TIER_DOC],
  leadingDriver: [TIER_DOC],
  driverScore: [TIER_DOC],
  weight: [TIER_DOC],
  contribution: [TIER_DOC],
  climate: [GARRETT_JONES, MORDECAI, MARTENS],
  vectorClockDriver: [CHAN, REISEN, MACDONALD],
  larvalDriver: [WHO_2009, BRETEAU],
  caseSignal: [BORTMAN, HUTWAGNER],
  casesThisWeek: [TIER_DOC],
  channelZone: [BORTMAN],
  latestWeather: [TIER_DOC],
  degreeDays: [MCMASTER, BASKERVILLE, ZALOM],
  generations: [MORDECAI, CRAIG],
  eip: [CHAN, REISEN, MACDONALD],
  survivalEip: [MORDECAI, MARTENS],
  rvc: [GARRETT_JONES],
  seasonWindow: [FORSYTHE, SPIELMAN],
  larvalIndices: [WHO_2009, BRETEAU],
};

/** Topics whose rule is Broodcast's own documented choice rather than a published method. */
export const OWN_RULE: ReadonlySet<HelpTopic> = new Set(['tier', 'tierRange', 'confidence', 'change', 'leadingDriver', 'driverScore', 'weight', 'contribution', 'casesThisWeek', 'latestWeather']);
