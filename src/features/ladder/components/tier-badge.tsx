import type { Tier } from '../../../../shared/tier';
import { useLadderWords, type Confidence } from '../ladder-format';
import { TIER_COLOURS, TIER_TEXT } from '../tier-scale';

/**
 * A tier as a swatch with its word, never colour alone. When the tier rests on stale or missing inputs it
 * loses its solid look (a dashed outline, lighter fill) and says why.
 */
export function TierBadge({ tier, confidence = 'ok' }: { tier: Tier; confidence?: Confidence }) {
  const words = useLadderWords();
  const mark = words.confidence(confidence);
  return (
    <span className="inline-flex flex-wrap items-center gap-x-1.5">
      <span
        className={`tier-badge${mark ? ' is-unsure' : ''}`}
        style={{ backgroundColor: TIER_COLOURS[tier], color: TIER_TEXT[tier] }}
        data-tier={tier}
      >
        {words.tier(tier)}
      </span>
      {mark ? <span className="confidence-mark">{mark}</span> : null}
    </span>
  );
}

/** The colour chip beside a tier word in lists and legends. */
export function TierSwatch({ tier }: { tier: Tier }) {
  return <span aria-hidden="true" className="tier-swatch" style={{ backgroundColor: TIER_COLOURS[tier] }} />;
}
