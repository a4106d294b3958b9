import { Fragment, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { tableFeatures, type ReactTable, type Row, type RowData } from '@tanstack/react-table';

/** The table features Broodcast's plain tables use (the core row model only, for now). */
export const plainTableFeatures = tableFeatures({});
export type PlainTableFeatures = typeof plainTableFeatures;

type DataTableProps<TData extends RowData> = {
  table: ReactTable<PlainTableFeatures, TData, any>;
  caption: ReactNode;
  /** Shown, in one full-width row, when there are no rows. */
  emptyText?: ReactNode;
  /** Extra content in a full-width row under a row (an inline editor, for instance). */
  renderBelowRow?: (row: Row<PlainTableFeatures, TData>) => ReactNode;
  captionVisible?: boolean;
};

/** Semantic, scrollable-on-small-screens markup around a TanStack Table model. */
export function DataTable<TData extends RowData>({
  table,
  caption,
  emptyText,
  renderBelowRow,
  captionVisible = false,
}: DataTableProps<TData>) {
  const { t } = useTranslation('components');
  const rows = table.getRowModel().rows;
  const columnCount = table.getAllLeafColumns().length;
  return (
    <div className="table-wrap">
      <table className="data-table">
        <caption className={captionVisible ? 'table-caption' : 'sr-only'}>{caption}</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => (
                <th key={header.id} scope="col" colSpan={header.colSpan}>
                  {header.isPlaceholder ? null : <table.FlexRender header={header} />}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columnCount} className="text-ink-muted">
                {emptyText ?? t('dataTable.empty')}
              </td>
            </tr>
          ) : (
            rows.map((row) => {
              const below = renderBelowRow?.(row);
              return (
                <Fragment key={row.id}>
                  <tr className={below ? 'is-expanded' : undefined}>
                    {row.getAllCells().map((cell) => (
                      <td key={cell.id}>
                        <table.FlexRender cell={cell} />
                      </td>
                    ))}
                  </tr>
                  {below ? (
                    <tr className="row-detail">
                      <td colSpan={columnCount}>{below}</td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })
          )}
        </tbody>
      </table>
    </div>
  );
}
