import { useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { UserDto } from '../../../../shared/api/users.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { FormMessage } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { useRoleLabel } from '../../../lib/labels';
import { useSession } from '../../../app/session';
import { useUpdateUser } from '../api/update-user.api';
import { STATUS_CLASS, userStatus } from '../user-status';
import { EditUserForm } from './edit-user.form';

const column = createColumnHelper<PlainTableFeatures, UserDto>();

const baseColumns = (t: TFunction, roleLabel: (role: UserDto['role']) => string) => [
  column.accessor('email', { header: t('fields.email'), cell: (c) => <span className="break-all">{c.getValue()}</span> }),
  column.accessor('displayName', { header: t('fields.name') }),
  column.accessor((u) => roleLabel(u.role), { id: 'role', header: t('fields.role') }),
  column.accessor((u) => u.districts.map((d) => d.code).join(', '), {
    id: 'districts',
    header: t('fields.districts'),
    cell: (c) => {
      const { districts, regions } = c.row.original;
      return (
        <>
          {regions.length > 0 ? (
            <span className="block" title={regions.map((r) => `${r.code} — ${r.name}`).join('\n')}>
              {t('table.regionsLine', { regions: regions.map((r) => r.name).join(', ') })}
            </span>
          ) : null}
          {districts.length === 0 ? (
            regions.length > 0 ? null : <span className="text-ink-muted">{t('table.noDistricts')}</span>
          ) : (
            <span title={districts.map((d) => `${d.code} — ${d.name}`).join('\n')}>{c.getValue()}</span>
          )}
        </>
      );
    },
  }),
  column.accessor((u) => userStatus(u), {
    id: 'status',
    header: t('table.status'),
    cell: (c) => <span className={STATUS_CLASS[c.getValue()]}>{t(`status.${c.getValue()}`)}</span>,
  }),
];

type Notice = { kind: 'error' | 'success'; text: string } | null;

export function UsersTable({ users }: { users: UserDto[] }) {
  const { t } = useTranslation('users');
  const roleLabel = useRoleLabel();
  const me = useSession();
  const update = useUpdateUser();
  const [editingId, setEditingId] = useState<string | null>(null);
  const [confirmingId, setConfirmingId] = useState<string | null>(null);
  const [notice, setNotice] = useState<Notice>(null);

  const data = useMemo(
    () => [...users].sort((a, b) => a.displayName.localeCompare(b.displayName) || a.email.localeCompare(b.email)),
    [users],
  );

  const setActive = async (user: UserDto, active: boolean) => {
    setNotice(null);
    try {
      await update.mutateAsync({ id: user.id, changes: { active } });
      setConfirmingId(null);
      setNotice({
        kind: 'success',
        text: active ? t('table.reactivated', { name: user.displayName }) : t('table.deactivated', { name: user.displayName }),
      });
    } catch (error) {
      setNotice({ kind: 'error', text: errorText(error) });
    }
  };

  const columns = useMemo(
    () =>
      column.columns([
        ...baseColumns(t, roleLabel),
        column.display({
          id: 'actions',
          header: t('table.actions'),
          cell: ({ row }) => {
            const user = row.original;
            const self = user.id === me.id;
            if (confirmingId === user.id) {
              return (
                <div className="flex min-w-56 flex-col gap-2">
                  <p className="text-sm">{t('table.confirmDeactivate', { name: user.displayName })}</p>
                  <div className="flex flex-wrap gap-2">
                    <button
                      type="button"
                      className="btn btn-primary btn-small"
                      disabled={update.isPending}
                      onClick={() => setActive(user, false)}
                    >
                      {t('table.yesDeactivate')}
                    </button>
                    <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirmingId(null)}>
                      {t('table.keepActive')}
                    </button>
                  </div>
                </div>
              );
            }
            return (
              <div className="flex flex-wrap gap-2">
                <button
                  type="button"
                  className="btn btn-secondary btn-small"
                  aria-expanded={editingId === user.id}
                  aria-label={t('table.editLabel', { name: user.displayName })}
                  onClick={() => {
                    setNotice(null);
                    setEditingId(editingId === user.id ? null : user.id);
                  }}
                >
                  {t('table.edit')}
                </button>
                {self ? (
                  <span className="self-center text-sm text-ink-muted">{t('table.you')}</span>
                ) : user.active ? (
                  <button
                    type="button"
                    className="btn btn-quiet btn-small"
                    aria-label={t('table.deactivateLabel', { name: user.displayName })}
                    onClick={() => {
                      setNotice(null);
                      setConfirmingId(user.id);
                    }}
                  >
                    {t('table.deactivate')}
                  </button>
                ) : (
                  <button
                    type="button"
                    className="btn btn-quiet btn-small"
                    aria-label={t('table.reactivateLabel', { name: user.displayName })}
                    disabled={update.isPending}
                    onClick={() => setActive(user, true)}
                  >
                    {t('table.reactivate')}
                  </button>
                )}
              </div>
            );
          },
        }),
      ]),
    [t, roleLabel, me.id, editingId, confirmingId, update.isPending],
  );

  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (u) => u.id });

  return (
    <div className="space-y-3">
      {notice ? <FormMessage kind={notice.kind}>{notice.text}</FormMessage> : null}
      <DataTable
        table={table}
        caption={t('table.caption')}
        emptyText={t('table.empty')}
        renderBelowRow={(row) =>
          editingId === row.original.id ? (
            <EditUserForm
              key={row.original.id}
              user={row.original}
              onClose={(saved) => {
                setEditingId(null);
                if (saved) setNotice({ kind: 'success', text: t('table.updated', { name: row.original.displayName }) });
              }}
            />
          ) : null
        }
      />
    </div>
  );
}
