import { useTranslation } from 'react-i18next';
import { ACTION_IDS, type ActionDto, type FlagDto } from '../../../shared/api/flags.schema';
import { DRIVERS } from '../../../shared/tier/tier-settings';
import { useFormat } from '../../i18n/format';

const isKnownAction = (id: string): id is (typeof ACTION_IDS)[number] => (ACTION_IDS as readonly string[]).includes(id);
const isKnownDriver = (id: string): id is (typeof DRIVERS)[number] => (DRIVERS as readonly string[]).includes(id);
const HISTORY_ACTIONS = ['flag.raised', 'flag.approved', 'flag.rejected', 'flag.lapsed', 'advisory.issued'];

/**
 * The words of the flag screens in the interface language. Reasons, statuses, history steps, drivers and
 * the suggested actions arrive as stable codes and are translated here; advisory messages arrive as a code
 * and numbers and are worded by useRenderMessage (message.ts); only a person's own words are shown as written.
 */
export function useFlagFormat() {
  const { t } = useTranslation('flags');
  const { dateTime } = useFormat();
  return {
    t,
    formatWhen: (iso: string) => dateTime(iso),
    reasonLabel: (f: Pick<FlagDto, 'reason'>) => t(`reason.${f.reason}`),
    statusLabel: (f: Pick<FlagDto, 'status'>) => t(`status.${f.status}`),
    raisedByLabel: (f: FlagDto) => (f.raisedBy ? f.raisedBy.displayName : t('seasonRun')),
    historyLabel: (action: string) => (HISTORY_ACTIONS.includes(action) ? t(`history.${action}`) : action),
    driverLabel: (d: { id: string; label: string }) => (isKnownDriver(d.id) ? t(`driver.${d.id}`) : d.label),
    /** A suggested action in the interface language (by its id), else as the server sent it. */
    action: (a: ActionDto) => (isKnownAction(a.id) ? { title: t(`action.${a.id}.title`), text: t(`action.${a.id}.text`) } : a),
    caution: () => t('actionCaution'),
  };
}
