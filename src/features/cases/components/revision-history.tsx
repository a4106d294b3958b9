import { i18n } from '../../../i18n';
import { FormMessage } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { useRevisions } from '../api/revisions.api';
import { useCaseFormat } from '../case-format';

/** Every version of one count: who, when, old, new and why. Loaded only when asked for. */
export function RevisionHistory({ countId }: { countId: string }) {
  const { t, formatDateTime } = useCaseFormat();
  const history = useRevisions(countId);
  const values = (v: { cases: number; confirmed: number | null; probable: number | null } | null) =>
    v === null
      ? '—'
      : v.confirmed !== null || v.probable !== null
        ? t('revisions.split', { cases: v.cases, confirmed: v.confirmed ?? '—', probable: v.probable ?? '—' })
        : String(v.cases);
  const source = (s: string) => (i18n.exists(`cases:revisions.source.${s}`) ? t(`revisions.source.${s}` as 'revisions.source.form') : s);
  if (history.isPending) return <p className="text-sm text-ink-muted">{t('revisions.loading')}</p>;
  if (history.isError) return <FormMessage kind="error">{errorText(history.error)}</FormMessage>;
  return (
    <div className="table-wrap">
      <table className="data-table" data-testid="revision-history">
        <caption className="table-caption">{t('revisions.caption')}</caption>
        <thead>
          <tr>
            <th scope="col">{t('revisions.version')}</th>
            <th scope="col">{t('revisions.when')}</th>
            <th scope="col">{t('revisions.who')}</th>
            <th scope="col">{t('revisions.was')}</th>
            <th scope="col">{t('revisions.became')}</th>
            <th scope="col">{t('revisions.reason')}</th>
          </tr>
        </thead>
        <tbody>
          {history.data.revisions.map((r) => (
            <tr key={r.version}>
              <td className="tabular-nums">
                {r.version} · {r.kind === 'entry' ? t('revisions.entered') : r.kind === 'void' ? t('revisions.voided') : t('revisions.corrected')} ({source(r.source)})
              </td>
              <td>{formatDateTime(r.at)}</td>
              <td>{r.actor?.displayName ?? (r.source === 'demo' ? t('revisions.demoData') : t('revisions.unknown'))}</td>
              <td className="tabular-nums">{values(r.old)}</td>
              <td className="tabular-nums">{values(r.new)}</td>
              <td>{r.reason ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
