'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  createColumnHelper,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { CreateInvitationSchema, type CreateInvitationInput, type Invitation, type Member } from '@/lib/schemas/account';
import type { Page } from '@/lib/schemas/common';
import { ROLES, ROLE_LABELS, type Role } from '@/lib/schemas/roles';
import { Button } from './ui/button';
import { DataTable } from './ui/data-table';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

const column = createColumnHelper<Member>();
const LIST_LIMIT = 200;
const NO_MEMBERS: Member[] = [];

export function MembersPanel({ lab, canManage, currentUserId }: { lab: string; canManage: boolean; currentUserId: string }) {
  const qc = useQueryClient();
  const base = `/api/v1/labs/${lab}`;
  const members = useQuery({ queryKey: ['members', lab], queryFn: () => apiFetch<Page<Member>>(`${base}/members?limit=${LIST_LIMIT}`) });
  const invitations = useQuery({
    queryKey: ['invitations', lab],
    queryFn: () => apiFetch<Page<Invitation>>(`${base}/invitations?limit=${LIST_LIMIT}`),
  });
  const [actionError, setActionError] = useState<string | null>(null);
  const refresh = () => {
    void qc.invalidateQueries({ queryKey: ['members', lab] });
    void qc.invalidateQueries({ queryKey: ['invitations', lab] });
  };
  const onError = (e: unknown) => setActionError(e instanceof Error ? e.message : 'Something went wrong.');

  const changeRole = useMutation({
    mutationFn: (v: { userId: string; role: Role }) => apiFetch(`${base}/members/${v.userId}`, { method: 'PATCH', body: { role: v.role } }),
    onSuccess: () => {
      setActionError(null);
      refresh();
    },
    onError: (e) => {
      onError(e);
      refresh();
    },
  });
  const remove = useMutation({
    mutationFn: (userId: string) => apiFetch(`${base}/members/${userId}`, { method: 'DELETE' }),
    onSuccess: refresh,
    onError,
  });

  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const columns = useMemo(
    () => [
      column.accessor('name', { header: 'Name' }),
      column.accessor('email', { header: 'E-mail', cell: (c) => <span className="tabular text-xs">{c.getValue()}</span> }),
      column.accessor('role', {
        header: 'Role',
        cell: (c) =>
          canManage ? (
            <select
              aria-label={`Role of ${c.row.original.name}`}
              value={c.getValue()}
              onChange={(e) => changeRole.mutate({ userId: c.row.original.userId, role: e.target.value as Role })}
              className="h-7 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-1.5 text-sm"
              data-testid={`role-select-${c.row.original.email}`}
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          ) : (
            ROLE_LABELS[c.getValue()]
          ),
      }),
      column.accessor('joinedAt', { header: 'Joined', cell: (c) => <span className="tabular text-xs">{c.getValue().slice(0, 10)}</span> }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) =>
          canManage || c.row.original.userId === currentUserId ? (
            <Button
              variant="quiet"
              size="sm"
              onClick={() => {
                const self = c.row.original.userId === currentUserId;
                if (window.confirm(self ? 'Leave this lab?' : `Remove ${c.row.original.name} from the lab?`)) remove.mutate(c.row.original.userId);
              }}
              data-testid={`remove-${c.row.original.email}`}
            >
              {c.row.original.userId === currentUserId ? 'Leave' : 'Remove'}
            </Button>
          ) : null,
      }),
    ],
    [canManage, currentUserId, changeRole, remove],
  );
  const table = useReactTable({
    data: members.data?.items ?? NO_MEMBERS,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <div className="space-y-10">
      {actionError ? <Notice tone="error" testId="members-error">{actionError}</Notice> : null}
      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="text-lg font-semibold">
          Members
        </h2>
        {members.isError ? <Notice tone="error">{(members.error as Error).message}</Notice> : null}
        <div className="mt-4">
          <DataTable table={table} testId="members-table" rowTestId={(row) => `member-row-${row.original.email}`} />
        </div>
      </section>

      {canManage ? <InviteForm lab={lab} onInvited={refresh} /> : null}

      <section aria-labelledby="pending-heading">
        <h2 id="pending-heading" className="text-lg font-semibold">
          Pending invitations
        </h2>
        {invitations.data && invitations.data.items.length === 0 ? <p className="mt-2 text-sm text-graphite-muted">None.</p> : null}
        <ul className="mt-3 divide-y-[0.5px] divide-rule" data-testid="invitations-list">
          {invitations.data?.items.map((inv) => (
            <PendingInvitation key={inv.id} inv={inv} base={base} canManage={canManage} onChange={refresh} onError={onError} />
          ))}
        </ul>
      </section>
    </div>
  );
}

function PendingInvitation({ inv, base, canManage, onChange, onError }: { inv: Invitation; base: string; canManage: boolean; onChange: () => void; onError: (e: unknown) => void }) {
  const resend = useMutation({ mutationFn: () => apiFetch(`${base}/invitations/${inv.id}/resend`, { method: 'POST' }), onSuccess: onChange, onError });
  const revoke = useMutation({ mutationFn: () => apiFetch(`${base}/invitations/${inv.id}`, { method: 'DELETE' }), onSuccess: onChange, onError });
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-2 text-sm" data-testid={`invitation-${inv.email}`}>
      <span>
        <span className="tabular text-xs">{inv.email}</span> · {ROLE_LABELS[inv.role]}
        <span className={`ml-2 text-xs ${inv.state === 'expired' ? 'text-danger' : 'text-graphite-muted'}`}>
          {inv.state === 'expired' ? 'expired' : `expires ${inv.expiresAt.slice(0, 10)}`}
        </span>
      </span>
      {canManage ? (
        <span className="flex gap-2">
          <Button variant="quiet" size="sm" onClick={() => resend.mutate()} disabled={resend.isPending}>
            {resend.isSuccess ? 'Sent again' : 'Resend'}
          </Button>
          <Button variant="danger" size="sm" onClick={() => revoke.mutate()} disabled={revoke.isPending}>
            Revoke
          </Button>
        </span>
      ) : null}
    </li>
  );
}

function InviteForm({ lab, onInvited }: { lab: string; onInvited: () => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<CreateInvitationInput>({
    resolver: zodResolver(CreateInvitationSchema),
    defaultValues: { role: 'reviewer' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSentTo(null);
    try {
      const inv = await apiFetch<Invitation>(`/api/v1/labs/${lab}/invitations`, { method: 'POST', body: values });
      setSentTo(inv.email);
      reset({ email: '', role: values.role });
      onInvited();
    } catch (error) {
      setFormError(applyApiError(error, setError, ['email', 'role']));
    }
  });
  return (
    <section aria-labelledby="invite-heading" data-testid="invite-section">
      <h2 id="invite-heading" className="text-lg font-semibold">
        Invite a colleague
      </h2>
      <form onSubmit={onSubmit} noValidate className="mt-4 flex flex-wrap items-end gap-4" data-testid="invite-form">
        <Field label="E-mail" type="email" className="min-w-64 flex-1" error={formState.errors.email?.message} data-testid="invite-email" {...register('email')} />
        <div>
          <label htmlFor="invite-role" className="block text-sm font-medium">
            Role
          </label>
          <select id="invite-role" {...register('role')} className="mt-1 h-9 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm" data-testid="invite-role">
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </div>
        <Button type="submit" disabled={formState.isSubmitting} data-testid="invite-submit">
          Send invitation
        </Button>
      </form>
      <div className="mt-3">
        {formError ? <Notice tone="error" testId="invite-error">{formError}</Notice> : null}
        {sentTo ? <Notice testId="invite-sent">Invitation sent to {sentTo}. The link works once, for 7 days.</Notice> : null}
      </div>
    </section>
  );
}
