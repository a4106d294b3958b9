/** Units a product amount may be given in (what sprayers and larvicide packets are measured in). */
export const AMOUNT_UNITS = ['ml', 'l', 'g', 'kg'] as const;
export type AmountUnit = (typeof AMOUNT_UNITS)[number];

/**
 * Before and after a piece of work (derived; Broodcast's own rule, not a published one): the larval
 * surveys of the same district in the `WINDOW_DAYS` days before the work date (the day itself excluded)
 * and in the `WINDOW_DAYS` days after it are pooled (WHO house, container and Breteau indices). No change
 * is stated unless each side has at least `MIN_SURVEYS_PER_SIDE` surveys: fewer is too little to compare
 * (common practice is to compare like-sized samples before and after a control activity).
 */
export const BEFORE_AFTER_RULE = { WINDOW_DAYS: 28, MIN_SURVEYS_PER_SIDE: 3 } as const;
