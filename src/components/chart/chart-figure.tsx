import { useId, useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { EChart, type EChartProps } from './echart';
import './chart.css';

type ChartFigureProps = EChartProps & {
  title: string;
  /** One or two plain sentences saying what the chart shows; read by screen readers and shown under the title. */
  summary: string;
  /** The same values as a table, behind the "Show as table" toggle. */
  table: ReactNode;
  headingLevel?: 'h2' | 'h3';
  /** Shown instead of the drawing when there is nothing to draw. */
  emptyText?: string | null;
  /** How many values lie beyond the plausible range of their axis and are not drawn (said under the drawing). */
  beyondAxis?: number;
};

/**
 * Every chart of Broodcast: a text heading, a sentence saying what it shows (the accessible name of the
 * drawing), the drawing, and a "Show as table" toggle with the same values.
 */
export function ChartFigure({ title, summary, table, headingLevel = 'h3', emptyText, beyondAxis = 0, ...chart }: ChartFigureProps) {
  const id = useId();
  const { t } = useTranslation('components');
  const [showTable, setShowTable] = useState(false);
  const Heading = headingLevel;
  return (
    <figure className="chart-figure" aria-labelledby={`${id}-title`} data-chart={title}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <Heading id={`${id}-title`} className="section-title">
          {title}
        </Heading>
        <button
          type="button"
          className="btn btn-quiet btn-small"
          aria-expanded={showTable}
          aria-controls={`${id}-table`}
          onClick={() => setShowTable((s) => !s)}
        >
          {showTable ? t('chart.hideTable') : t('chart.showTable')}
        </button>
      </div>
      <p id={`${id}-summary`} className="mt-1 text-sm text-ink-muted">
        {summary}
      </p>
      {emptyText ? (
        <p className="chart-empty">{emptyText}</p>
      ) : (
        <div className="chart-box" role="img" aria-label={`${title}. ${summary}`} data-testid="chart-box">
          <EChart {...chart} />
        </div>
      )}
      {!emptyText && beyondAxis > 0 ? (
        <p className="mt-1 text-sm text-ink-muted" data-beyond-axis={beyondAxis}>
          {t('chart.beyondAxis', { count: beyondAxis })}
        </p>
      ) : null}
      <div id={`${id}-table`} hidden={!showTable}>
        {showTable ? table : null}
      </div>
    </figure>
  );
}
