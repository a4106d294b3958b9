import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage, TextField } from '../../components/form';
import { useSession } from '../../app/session';
import { downloadCsv } from '../../lib/csv';
import { errorText } from '../../lib/error-text';
import { useFormat } from '../../i18n/format';
import { useDistricts } from '../districts/api/districts.api';
import { CautionsPanel } from '../cautions/cautions-panel';
import { OutboxList, type OutboxWords } from '../surveys/components/outbox.list';
import { localToday } from '../surveys/survey-format';
import { fieldRecordsQueryOptions, useFieldRecords } from './api/field-records.api';
import { FieldRecordForm } from './components/field-record.form';
import { FieldRecordsList } from './components/field-records.list';
import { mondayOf, recordMessage, RECORD_LABEL_KEYS } from './field-log-format';
import { fieldRecordsCsv } from './field-records.csv';
import { useFieldRecordOutbox } from './use-field-record-outbox';

const OUTBOX_WORDS: OutboxWords = { namespace: 'field-log', labelKeys: RECORD_LABEL_KEYS, message: recordMessage, testId: 'record-outbox' };

/**
 * The Field log (issue 19): a team member or an officer records each piece of vector-control work, online
 * or not. The form saves to the device first; below it, what waits to be sent, what has arrived, and the
 * records of a week as CSV.
 */
export function FieldLogPage() {
  const { t } = useTranslation('field-log');
  const me = useSession();
  const districts = useDistricts();
  const outbox = useFieldRecordOutbox();
  const mine = useFieldRecords({ mine: true });
  // A community worker records work in their own districts; a health officer in any district.
  const choices = me.role === 'worker' ? me.districts : (districts.data ?? []).map(({ id, code, name }) => ({ id, code, name }));
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('page.lead')}>{t('page.title')}</PageHeading>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,28rem)_minmax(0,1fr)]">
        <div className="card min-w-0">
          {choices.length ? (
            <FieldRecordForm districts={choices} />
          ) : (
            <p className="text-ink-muted">{me.role === 'worker' ? t('page.noDistricts') : t('page.loadingDistricts')}</p>
          )}
        </div>
        <div className="min-w-0 space-y-6">
          <OutboxList items={outbox.items} onRetry={outbox.retry} onDiscard={outbox.discard} words={OUTBOX_WORDS} />
          <section aria-labelledby="sent-title" className="space-y-2">
            <h2 id="sent-title" className="section-title">
              {t('sent.title')}
            </h2>
            {mine.isPending ? (
              <p className="text-sm text-ink-muted">{t('sent.loading')}</p>
            ) : mine.isError ? (
              <FormMessage kind="error">{errorText(mine.error)}</FormMessage>
            ) : (
              <FieldRecordsList records={mine.data.records} />
            )}
          </section>
          <WeekCsv />
          <CautionsPanel />
        </div>
      </div>
    </section>
  );
}

/** The records of one week (Monday to Sunday) as a CSV file; a week not over yet holds the records up to now. */
function WeekCsv() {
  const { t } = useTranslation(['field-log', 'field-week']);
  const queryClient = useQueryClient();
  const { date } = useFormat();
  const today = localToday();
  const [day, setDay] = useState(mondayOf(today));
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const valid = /^\d{4}-\d{2}-\d{2}$/.test(day) && day <= today;
  const weekStart = valid ? mondayOf(day) : null;
  const unfinished = weekStart !== null && mondayOf(today) === weekStart;
  const download = async () => {
    if (!weekStart) return;
    setProblem(null);
    setBusy(true);
    try {
      const { records } = await queryClient.fetchQuery({ ...fieldRecordsQueryOptions({ weekStart }), staleTime: 0 });
      downloadCsv(
        `broodcast-field-records-${weekStart}.csv`,
        fieldRecordsCsv(records, {
          header: (['date', 'code', 'district', 'locality', 'kind', 'housesVisited', 'containers', 'areaM2', 'product', 'amount', 'unit', 'notes', 'recordedBy'] as const).map((k) => t(`csv.${k}`)),
          kind: (k) => t(`field-week:kinds.${k}`),
        }),
      );
    } catch (error) {
      setProblem(errorText(error));
    } finally {
      setBusy(false);
    }
  };
  return (
    <section aria-labelledby="csv-title" className="space-y-2">
      <h2 id="csv-title" className="section-title">
        {t('csv.title')}
      </h2>
      <TextField
        label={t('csv.week')}
        type="date"
        max={today}
        value={day}
        onChange={(e) => setDay(e.currentTarget.value)}
        hint={weekStart ? t('csv.weekOf', { monday: date(weekStart) }) : undefined}
        error={valid ? undefined : t('csv.badWeek')}
      />
      {unfinished ? <p className="text-sm text-ink-muted">{t('csv.unfinished')}</p> : null}
      {problem ? <FormMessage kind="error">{problem}</FormMessage> : null}
      <button type="button" className="btn btn-secondary" disabled={!weekStart || busy} onClick={() => void download()}>
        {t('csv.download')}
      </button>
    </section>
  );
}
