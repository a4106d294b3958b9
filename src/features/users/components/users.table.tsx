import { useMemo, useState } from 'react';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { UserDto } from '../../../../shared/api/users.schema';
import { ROLE_LABELS } from '../../../../shared/roles';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../../components/data-table';
import { FormMessage } from '../../../components/form';
import { formErrorText } from '../../../lib/form-errors';
import { isApiError } from '../../../lib/api-client';
import { useSession } from '../../../app/session';
import { useUpdateUser } from '../api/update-user.api';
import { STATUS_CLASS, userStatus } from '../user-status';
import { EditUserForm } from './edit-user.form';

const column = createColumnHelper<PlainTableFeatures, UserDto>();

const baseColumns = [
  column.accessor('email', { header: 'E-mail', cell: (c) => <span className="break-all">{c.getValue()}</span> }),
  column.accessor('displayName', { header: 'Name' }),
  column.accessor((u) => ROLE_LABELS[u.role], { id: 'role', header: 'Role' }),
  column.accessor((u) => u.districts.map((d) => d.code).join(', '), {
    id: 'districts',
    header: 'Districts',
    cell: (c) => {
      const districts = c.row.original.districts;
      return districts.length === 0 ? (
        <span className="text-ink-muted">None</span>
      ) : (
        <span title={districts.map((d) => `${d.code} — ${d.name}`).join('\n')}>{c.getValue()}</span>
      );
    },
  }),
  column.accessor((u) => userStatus(u), {
    id: 'status',
    header: 'Status',
    cell: (c) => <span className={STATUS_CLASS[c.getValue()]}>{c.getValue()}</span>,
  }),
];

type Notice = { kind: 'error' | 'success'; text: string } | null;

export function UsersTable({ users }: { users: UserDto[] }) {
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
        text: active ? `${user.displayName} can sign in again.` : `${user.displayName} is deactivated and can no longer sign in.`,
      });
    } catch (error) {
      setNotice({ kind: 'error', text: isApiError(error) ? error.message : formErrorText(error) });
    }
  };

  const columns = useMemo(
    () =>
      column.columns([
        ...baseColumns,
        column.display({
          id: 'actions',
          header: 'Actions',
          cell: ({ row }) => {
            const user = row.original;
            const self = user.id === me.id;
            if (confirmingId === user.id) {
              return (
                <div className="flex min-w-56 flex-col gap-2">
                  <p className="text-sm">Deactivate {user.displayName}? They will no longer be able to sign in.</p>
                  <div className="flex flex-wrap gap-2">
                    <button
                      type="button"
                      className="btn btn-primary btn-small"
                      disabled={update.isPending}
                      onClick={() => setActive(user, false)}
                    >
                      Yes, deactivate
                    </button>
                    <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirmingId(null)}>
                      Keep active
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
                  aria-label={`Edit ${user.displayName}`}
                  onClick={() => {
                    setNotice(null);
                    setEditingId(editingId === user.id ? null : user.id);
                  }}
                >
                  Edit
                </button>
                {self ? (
                  <span className="self-center text-sm text-ink-muted">(you)</span>
                ) : user.active ? (
                  <button
                    type="button"
                    className="btn btn-quiet btn-small"
                    aria-label={`Deactivate ${user.displayName}`}
                    onClick={() => {
                      setNotice(null);
                      setConfirmingId(user.id);
                    }}
                  >
                    Deactivate
                  </button>
                ) : (
                  <button
                    type="button"
                    className="btn btn-quiet btn-small"
                    aria-label={`Reactivate ${user.displayName}`}
                    disabled={update.isPending}
                    onClick={() => setActive(user, true)}
                  >
                    Reactivate
                  </button>
                )}
              </div>
            );
          },
        }),
      ]),
    [me.id, editingId, confirmingId, update.isPending],
  );

  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (u) => u.id });

  return (
    <div className="space-y-3">
      {notice ? <FormMessage kind={notice.kind}>{notice.text}</FormMessage> : null}
      <DataTable
        table={table}
        caption="Users of this Broodcast deployment"
        emptyText="No users yet."
        renderBelowRow={(row) =>
          editingId === row.original.id ? (
            <EditUserForm
              key={row.original.id}
              user={row.original}
              onClose={(saved) => {
                setEditingId(null);
                if (saved) setNotice({ kind: 'success', text: `${row.original.displayName} is updated.` });
              }}
            />
          ) : null
        }
      />
    </div>
  );
}
