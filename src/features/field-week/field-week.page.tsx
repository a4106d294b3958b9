import { useEffect, useId, useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { FieldWeekDto } from '../../../shared/api/field.schema';
import { FormMessage, TextField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { may } from '../../../shared/permissions';
import { useSession } from '../../app/session';
import { errorText } from '../../lib/error-text';
import { useFormat } from '../../i18n/format';
import { downloadCsv } from '../../lib/csv';
import { fieldWeekCsv } from './field-week.csv';
import { useFieldWeek } from './api/field-week.api';
import { useProposeFieldWeek } from './api/propose-field-week.api';
import { usePublishFieldWeek } from './api/publish-field-week.api';
import { useSaveFieldWeekDays } from './api/save-field-week-days.api';
import { FieldTeamsSection } from './components/field-teams.section';
import { ReviewFieldWeek } from './components/review-field-week';

type Picks = Record<string, string>; // `${teamId}|${day}` → districtId ('' = no district)
const cell = (teamId: string, day: string) => `${teamId}|${day}`;
const picksOf = (week: FieldWeekDto): Picks => Object.fromEntries(week.days.map((d) => [cell(d.teamId, d.day), d.districtId]));

/**
 * The Field week (health officer): Broodcast proposes which team goes to which district on which days of
 * the coming week; the officer changes any day by picking another district, saves, and publishes — each
 * team member then gets their days by mail in their language.
 */
export function FieldWeekPage() {
  const { t } = useTranslation('field-week');
  const f = useFormat();
  // Supervisors and team members read the week; only the health officer keeps teams and plans.
  const role = useSession().role;
  const plans = may(role, 'field.plan');
  const approves = may(role, 'field.approve');
  const id = useId();
  const [weekStart, setWeekStart] = useState('');
  const [travel, setTravel] = useState('150');
  const key = weekStart || null;
  const week = useFieldWeek(key);
  const propose = useProposeFieldWeek(key);
  const save = useSaveFieldWeekDays(key);
  const publish = usePublishFieldWeek(key);
  const data = week.data ?? null;
  const [picks, setPicks] = useState<Picks>({});
  useEffect(() => setPicks(data ? picksOf(data) : {}), [data]);
  const dirty = useMemo(() => (data ? JSON.stringify(picks) !== JSON.stringify(picksOf(data)) : false), [picks, data]);
  // A week waiting for a supervisor's approval is as fixed as a published one until it is sent back.
  const published = (data !== null && data.status !== 'draft') || !plans;
  const byRank = useMemo(() => (data ? [...data.districts].sort((a, b) => a.rank - b.rank) : []), [data]);

  const onPropose = () => propose.mutate({ ...(weekStart ? { weekStart } : {}), maxTravelKm: Number(travel) });
  const onSave = () => {
    if (!data) return;
    const days = Object.entries(picks).filter(([, d]) => d).map(([k, districtId]) => {
      const [teamId, day] = k.split('|');
      return { teamId, districtId, day };
    });
    save.mutate({ id: data.id, body: { days } });
  };
  const error = propose.error ?? save.error ?? publish.error ?? null;

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={plans ? t('lead') : t('readLead')}>{t('title')}</PageHeading>
      <p className="mb-4 text-sm">{t('caution')}</p>

      {plans ? <FieldTeamsSection /> : null}

      {plans ? <div className="card mb-6 space-y-4">
        <h2 className="section-title">{t('proposeTitle')}</h2>
        <div className="flex flex-wrap items-end gap-4">
          <TextField label={t('weekStart')} hint={t('weekStartHint')} type="date" value={weekStart} onChange={(e) => setWeekStart(e.currentTarget.value)} />
          <TextField label={t('travel')} hint={t('travelHint')} type="number" min={1} max={2000} inputMode="numeric" value={travel} onChange={(e) => setTravel(e.currentTarget.value)} />
        </div>
        <button type="button" className="btn btn-primary" onClick={onPropose} disabled={propose.isPending || published}>
          {propose.isPending ? t('proposing') : t('propose')}
        </button>
      </div> : null}

      <FormMessage kind="error">{error ? errorText(error) : null}</FormMessage>

      {week.isPending ? (
        <p className="text-ink-muted">{t('loading')}</p>
      ) : week.isError ? (
        <FormMessage kind="error">{errorText(week.error)}</FormMessage>
      ) : !data ? (
        <p>{t('none')}</p>
      ) : (
        <>
          <div className="card mb-6 space-y-2" aria-live="polite">
            <h2 className="section-title">{t('weekOf', { start: f.date(data.workingDays[0]), end: f.date(data.workingDays[data.workingDays.length - 1]) })}</h2>
            <p className="font-bold">{t(`status.${data.status}`)}{data.edited ? ` · ${t('edited')}` : ''}</p>
            {data.status === 'draft' && data.review?.decision === 'sent_back' ? <p role="note">{t('review.sentBack', { by: data.review.by ?? '—', reason: data.review.reason ?? '' })}</p> : null}
            <p>{t('covered', { covered: f.number(data.coveredRisk, 0), total: f.number(data.totalRisk, 0), ladder: f.number(data.ladderOrderRisk, 0) })}</p>
            <p className="text-sm">{data.ladderWeek ? t('ladderWeek', { year: data.ladderWeek.year, week: data.ladderWeek.week }) : t('noLadder')}</p>
            <p className="text-sm">{t('method', { km: f.number(data.maxTravelKm, 0) })}</p>
            <p className="text-sm">{t('visitWeight')}</p>
          </div>

          {approves && data.status === 'awaiting_approval' ? <ReviewFieldWeek id={data.id} weekStart={key} /> : null}

          {data.teams.length === 0 ? <p>{t('noTeams')}</p> : !plans ? (
            <div className="mb-4 space-y-4">
              {data.teams.map((team) => (
                <div key={team.id} className="card">
                  <h2 className="section-title">{team.name}</h2>
                  <ul>
                    {data.workingDays.map((day) => {
                      const d = data.districts.find((x) => x.districtId === picks[cell(team.id, day)]);
                      return <li key={day}><strong>{f.date(day)}</strong>{': '}{d ? `${d.name} (${d.workNeeded.map((k) => t(`kinds.${k}`)).join(', ')})` : t('noDistrict')}</li>;
                    })}
                  </ul>
                </div>
              ))}
            </div>
          ) : (
            <div className="table-wrap mb-4">
              <table className="data-table">
                <caption className="table-caption">{t('planCaption')}</caption>
                <thead>
                  <tr>
                    <th scope="col">{t('team')}</th>
                    {data.workingDays.map((day) => <th key={day} scope="col">{f.date(day)}</th>)}
                  </tr>
                </thead>
                <tbody>
                  {data.teams.map((team) => (
                    <tr key={team.id}>
                      <th scope="row">
                        {team.name}
                        <br />
                        <small>{t('teamLine', { base: team.baseDistrict.name, days: team.daysPerWeek })}</small>
                      </th>
                      {data.workingDays.map((day) => (
                        <td key={day}>
                          <label className="sr-only" htmlFor={`${id}-${team.id}-${day}`}>{t('pickLabel', { team: team.name, day: f.date(day) })}</label>
                          <select
                            id={`${id}-${team.id}-${day}`}
                            className="input"
                            value={picks[cell(team.id, day)] ?? ''}
                            disabled={published}
                            onChange={(e) => {
                              const value = e.currentTarget.value;
                              setPicks((p) => ({ ...p, [cell(team.id, day)]: value }));
                            }}
                          >
                            <option value="">{t('noDistrict')}</option>
                            {byRank.map((d) => <option key={d.districtId} value={d.districtId}>{`${d.rank}. ${d.name}`}</option>)}
                          </select>
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}

          <p className="mb-4">
            <button
              type="button"
              className="btn btn-secondary"
              onClick={() => downloadCsv(`broodcast-field-week-${data.weekStart}.csv`, fieldWeekCsv(data, {
                header: [t('csv.day'), t('csv.team'), t('csv.code'), t('csv.district'), t('csv.tier'), t('csv.work')],
                tier: (x) => (x ? t(`tiers.${x}`) : t('noTier')),
                kind: (k) => t(`kinds.${k}`),
              }))}
            >
              {t('csv.download')}
            </button>
          </p>

          {!plans || data.status === 'awaiting_approval' ? null : published ? (
            <FormMessage kind="success">{t('publishedAt', { at: f.dateTime(data.publishedAt) })}{data.mailed !== undefined ? ` ${t('mailed', { count: data.mailed })}` : ''}</FormMessage>
          ) : (
            <div className="mb-6 flex flex-wrap gap-3">
              <button type="button" className="btn btn-secondary" onClick={onSave} disabled={!dirty || save.isPending}>{save.isPending ? t('saving') : t('save')}</button>
              <button type="button" className="btn btn-primary" onClick={() => publish.mutate(data.id)} disabled={dirty || publish.isPending}>
                {publish.isPending ? t('publishing') : t('publish')}
              </button>
              {dirty ? <p className="text-sm">{t('saveFirst')}</p> : null}
            </div>
          )}

          <div className="table-wrap">
            <table className="data-table">
              <caption className="table-caption">{t('whyCaption')}</caption>
              <thead>
                <tr>
                  <th scope="col">{t('rank')}</th>
                  <th scope="col">{t('district')}</th>
                  <th scope="col">{t('tier')}</th>
                  <th scope="col">{t('risk')}</th>
                  <th scope="col">{t('days')}</th>
                  <th scope="col">{t('why')}</th>
                </tr>
              </thead>
              <tbody>
                {byRank.map((d) => (
                  <tr key={d.districtId}>
                    <td>{d.rank}</td>
                    <th scope="row">{d.name}</th>
                    <td>{d.tier ? t(`tiers.${d.tier}`) : t('noTier')}</td>
                    <td>{f.number(d.risk, 0)}</td>
                    <td>{t('daysOf', { planned: d.daysProposed, needed: d.daysNeeded })}</td>
                    <td>{reasonText(t, d.reason)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
    </section>
  );
}

type T = ReturnType<typeof useTranslation>['t'];
/** A district's reason, worded from its code and parameters (lists of teams and kinds of work joined). */
function reasonText(t: T, reason: FieldWeekDto['districts'][number]['reason']): string {
  const p = reason.params;
  const list = (x: unknown) => (Array.isArray(x) ? x : []);
  return t(`reasons.${reason.code}`, {
    ...p,
    teams: list(p.teams).join(', '),
    kinds: list(p.kinds).map((k) => t(`kinds.${String(k)}`)).join(', '),
    tier: typeof p.tier === 'string' ? t(`tiers.${p.tier}`) : '',
  });
}
