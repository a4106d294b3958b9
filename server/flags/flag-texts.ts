import { ACTIONS, type ActionDto, type ActionId, type AdvisoryMessage, type FlagReason, type MessageCode, type MessageParams } from '../../shared/api/flags.schema';
import { renderMessageWith } from '../../shared/flags/advisory-message';
import { tierRank, type Tier } from '../../shared/tier';
import { DEFAULT_LANGUAGE, formatFor, textsFor, type Language } from '../i18n';

/**
 * The actions as stored with a flag and an advisory: id, and the English title and text (the API's
 * words). Mails and bulletins show them in the reader's language by id (advisory.mails.ts actionIn).
 */
export const actionsOf = (ids: readonly ActionId[]): ActionDto[] => ids.map((id) => ({ id, ...ACTIONS[id] }));

/** The actions a flag suggests: case finding when cases lead, breeding-site work when the tier rises. */
export function suggestedActions(reason: FlagReason, tier: Tier | null): ActionDto[] {
  if (reason === 'channel-above' || reason === 'case-alarm') return actionsOf(['case-finding', 'source-reduction', 'community-clean-up']);
  if (tier && tierRank(tier) >= tierRank('high')) return actionsOf(['source-reduction', 'community-clean-up', 'larval-survey', 'case-finding']);
  return actionsOf(['source-reduction', 'larval-survey']);
}

/**
 * A message stored as code and numbers, in one language (the server's side of shared/flags/advisory-message.ts;
 * the client words the same keys with its own texts).
 */
export function renderMessage(code: MessageCode, params: MessageParams, language: Language = DEFAULT_LANGUAGE): string {
  const f = formatFor(language);
  const t = textsFor(language, 'flags');
  return renderMessageWith({ t: (key, vars) => t(key, vars), percent: (x) => f.percent(x), date: (iso) => f.date(iso) }, { code, params });
}

/** The English wording kept for the record (flags.suggested_message, advisories.message, the audit trail). */
export const englishMessage = (m: AdvisoryMessage): string => renderMessage(m.code, m.params, 'en');

/**
 * An advisory's message for one reader: worded from its code in the reader's language; an advisory issued
 * before messages were composed has only its stored text (`composed` null), shown as stored.
 */
export function messageFor(language: Language, stored: string, composed: AdvisoryMessage | null): string {
  return composed ? renderMessage(composed.code, composed.params, language) : stored;
}
