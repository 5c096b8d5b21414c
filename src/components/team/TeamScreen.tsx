import { useState, type SubmitEvent } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import DataTable from './DataTable';
import Field from './Field';
import { errorOf, formatWhen, send } from './format';
import type * as rows from '../../lib/schemas/rows';
import type { Role, Wire } from '../../lib/schemas/rows';

type MemberRow = Wire<rows.MemberRow>;
type InvitationRow = Wire<rows.InvitationRow>;
type ShareRow = Wire<rows.ShareRow>;
type AuditRow = Wire<rows.AuditRow>;

const ROLE_TEXT: Record<Role, string> = {
  admin: 'Admin: everything, plus members and roles',
  engineer: 'Engineer: builds, saves, runs, issues and shares',
  checker: 'Checker: reads, comments, marks checked or sends back',
};

const ACTION_TEXT: Record<string, string> = {
  sign_in: 'Signed in',
  sign_in_failed: 'Failed sign-in',
  sign_out: 'Signed out',
  sign_up: 'Signed up',
  password_reset: 'Password reset',
  team_created: 'Team created',
  role_changed: 'Role changed',
  member_removed: 'Member removed',
  member_left: 'Member left',
  invitation_sent: 'Invitation sent',
  invitation_revoked: 'Invitation withdrawn',
  invitation_accepted: 'Invitation accepted',
  share_created: 'Share link made',
  share_opened: 'Share link opened',
  share_revoked: 'Share link revoked',
  revision_issued: 'Revision issued',
  job_exported: 'Job backup downloaded',
  job_restored: 'Job restored from a backup',
};

function detailText(row: AuditRow): string {
  const d = row.detail ?? {};
  if (row.action === 'role_changed') return `${String(d.from)} → ${String(d.to)}`;
  if (row.action === 'invitation_sent' || row.action === 'invitation_accepted') return `as ${String(d.role)}`;
  if (row.action === 'sign_in_failed') return String(d.reason ?? '').replace('_', ' ');
  if (row.action === 'share_created' && d.label) return String(d.label);
  return '';
}

function Notice({ text, tone }: { text: string | null; tone: 'ok' | 'error' }) {
  if (!text) return null;
  return (
    <p role={tone === 'error' ? 'alert' : 'status'} className={`rounded border px-3 py-2 text-sm ${tone === 'error' ? 'border-danger/30 bg-danger-soft text-danger' : 'border-line bg-accent-soft'}`}>
      {text}
    </p>
  );
}

/** the Team screen: members and roles, invitations, share links and (for admins) the audit log */
export default function TeamScreen({ teamId, myUserId, role }: { teamId: number; myUserId: string; role: Role }) {
  const isAdmin = role === 'admin';
  const canShare = role === 'admin' || role === 'engineer';
  const [reload, setReload] = useState(0);
  const [notice, setNotice] = useState<{ text: string; tone: 'ok' | 'error' } | null>(null);
  const [inviteErrors, setInviteErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const refresh = () => setReload((n) => n + 1);

  async function act(res: Promise<Response>, ok: string) {
    const r = await res;
    if (!r.ok) setNotice({ text: (await errorOf(r)).message, tone: 'error' });
    else setNotice({ text: ok, tone: 'ok' });
    refresh();
    return r.ok;
  }

  async function changeRole(m: MemberRow, to: Role) {
    await act(send('PATCH', `/api/teams/${teamId}/members/${encodeURIComponent(m.userId)}`, { role: to }), `${m.name} is now ${to}.`);
  }
  async function remove(m: MemberRow) {
    const self = m.userId === myUserId;
    if (!window.confirm(self ? 'Leave this team? You lose access to its jobs.' : `Remove ${m.name} from the team? Their saved revisions stay.`)) return;
    const ok = await act(send('DELETE', `/api/teams/${teamId}/members/${encodeURIComponent(m.userId)}`), self ? 'You left the team.' : `${m.name} was removed.`);
    if (ok && self) window.location.href = '/jobs';
  }

  async function inviteSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const form = new FormData(formEl);
    setBusy(true);
    const res = await send('POST', `/api/teams/${teamId}/invitations`, { email: String(form.get('email') ?? ''), role: String(form.get('role') ?? 'engineer') });
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setInviteErrors(err.fields);
      setNotice({ text: err.message, tone: 'error' });
      return;
    }
    setInviteErrors({});
    setNotice({ text: `Invitation sent to ${String(form.get('email'))}. The link lasts 7 days.`, tone: 'ok' });
    formEl.reset();
    refresh();
  }

  const memberColumns: ColumnDef<MemberRow>[] = [
    { id: 'name', header: 'Name', cell: ({ row }) => <span className="font-semibold">{row.original.name}{row.original.userId === myUserId ? ' (you)' : ''}</span> },
    { id: 'email', header: 'E-mail', cell: ({ row }) => row.original.email },
    {
      id: 'role',
      header: 'Role',
      cell: ({ row }) =>
        isAdmin ? (
          <select
            aria-label={`Role of ${row.original.name}`}
            value={row.original.role}
            onChange={(e) => changeRole(row.original, e.target.value as Role)}
            className="rounded border border-line bg-panel px-1 py-0.5"
            title={ROLE_TEXT[row.original.role]}
          >
            <option value="admin">admin</option>
            <option value="engineer">engineer</option>
            <option value="checker">checker</option>
          </select>
        ) : (
          <span title={ROLE_TEXT[row.original.role]}>{row.original.role}</span>
        ),
    },
    { id: 'joinedAt', header: 'Joined', cell: ({ row }) => formatWhen(row.original.joinedAt) },
    {
      id: 'actions',
      header: '',
      enableSorting: false,
      cell: ({ row }) =>
        isAdmin || row.original.userId === myUserId ? (
          <button type="button" className="text-sm text-danger hover:underline" onClick={() => remove(row.original)}>
            {row.original.userId === myUserId ? 'Leave team' : 'Remove'}
          </button>
        ) : null,
    },
  ];

  const invitationColumns: ColumnDef<InvitationRow>[] = [
    { id: 'email', header: 'E-mail', cell: ({ row }) => row.original.email },
    { id: 'role', header: 'Role', cell: ({ row }) => row.original.role },
    { id: 'createdAt', header: 'Sent', cell: ({ row }) => `${formatWhen(row.original.createdAt)}${row.original.invitedByName ? ` by ${row.original.invitedByName}` : ''}` },
    { id: 'expiresAt', header: 'Expires', cell: ({ row }) => formatWhen(row.original.expiresAt) },
    { id: 'status', header: 'Status', enableSorting: false, cell: ({ row }) => row.original.status },
    {
      id: 'actions',
      header: '',
      enableSorting: false,
      cell: ({ row }) =>
        row.original.status === 'open' ? (
          <button type="button" className="text-sm text-danger hover:underline" onClick={() => act(send('POST', `/api/invitations/${row.original.id}/revoke`), `The invitation to ${row.original.email} is withdrawn.`)}>
            Withdraw
          </button>
        ) : null,
    },
  ];

  const shareColumns: ColumnDef<ShareRow>[] = [
    {
      id: 'assemblyName',
      header: 'Revision',
      cell: ({ row }) => (
        <a className="text-accent-strong hover:underline" href={`/assemblies/${row.original.assemblyId}/history?rev=${row.original.revisionId}`}>
          {row.original.jobName} · {row.original.assemblyName} · R{row.original.revisionNumber}
        </a>
      ),
    },
    { id: 'label', header: 'Label', cell: ({ row }) => row.original.label || '—' },
    { id: 'createdAt', header: 'Made', cell: ({ row }) => `${formatWhen(row.original.createdAt)}${row.original.createdByName ? ` by ${row.original.createdByName}` : ''}` },
    { id: 'expiresAt', header: 'Expires', cell: ({ row }) => (row.original.expiresAt ? formatWhen(row.original.expiresAt) : 'never') },
    { id: 'lastOpenedAt', header: 'Last opened', cell: ({ row }) => (row.original.lastOpenedAt ? formatWhen(row.original.lastOpenedAt) : 'not yet') },
    { id: 'openCount', header: 'Opens', meta: { align: 'right' }, cell: ({ row }) => row.original.openCount },
    { id: 'status', header: 'Status', enableSorting: false, cell: ({ row }) => row.original.status },
    {
      id: 'actions',
      header: '',
      enableSorting: false,
      cell: ({ row }) =>
        canShare && row.original.status === 'active' ? (
          <button
            type="button"
            className="text-sm text-danger hover:underline"
            onClick={() => {
              if (window.confirm('Revoke this link? Anyone holding it sees a “withdrawn” page from now on.')) void act(send('POST', `/api/shares/${row.original.id}/revoke`), 'The link is revoked.');
            }}
          >
            Revoke
          </button>
        ) : null,
    },
  ];

  const auditColumns: ColumnDef<AuditRow>[] = [
    { id: 'createdAt', header: 'When', cell: ({ row }) => <span className="whitespace-nowrap">{formatWhen(row.original.createdAt)}</span> },
    { id: 'action', header: 'What', cell: ({ row }) => <span className={row.original.success ? '' : 'text-danger font-semibold'}>{ACTION_TEXT[row.original.action] ?? row.original.action}</span> },
    { id: 'actorName', header: 'Who', cell: ({ row }) => row.original.actorName ?? (row.original.action.startsWith('share_opened') ? 'guest' : '—') },
    { id: 'target', header: 'On', cell: ({ row }) => row.original.targetText || '—' },
    { id: 'detail', header: 'Detail', enableSorting: false, cell: ({ row }) => detailText(row.original) || '—' },
    { id: 'ip', header: 'From', enableSorting: false, cell: ({ row }) => <span className="tabular text-ink-soft">{row.original.ip || '—'}</span> },
  ];

  return (
    <div className="space-y-8">
      <div aria-live="polite">{notice ? <Notice text={notice.text} tone={notice.tone} /> : null}</div>

      <section aria-labelledby="members-h" className="space-y-3">
        <h2 id="members-h" className="text-lg font-semibold">Members</h2>
        <DataTable<MemberRow> endpoint={`/api/teams/${teamId}/members`} columns={memberColumns} defaultSort="name" filterHint="name, e-mail or role" caption="Members" empty="No members." reloadKey={reload} rowKey={(r) => r.userId} testId="members-table" />
        <ul className="text-xs text-ink-soft space-y-0.5">
          {(Object.keys(ROLE_TEXT) as Role[]).map((r) => <li key={r}>{ROLE_TEXT[r]}</li>)}
        </ul>
      </section>

      {isAdmin ? (
        <section aria-labelledby="invite-h" className="space-y-3">
          <h2 id="invite-h" className="text-lg font-semibold">Invitations</h2>
          <form onSubmit={inviteSubmit} noValidate className="flex flex-wrap items-end gap-3 rounded border border-line bg-panel p-3" aria-label="Invite by e-mail">
            <Field label="E-mail" name="email" type="email" required error={inviteErrors.email} className="w-72" />
            <label className="block text-sm" htmlFor="f-invite-role">
              <span className="font-semibold">Role</span>
              <select id="f-invite-role" name="role" defaultValue="engineer" className="mt-1 block rounded border border-line bg-panel px-2 py-1.5">
                <option value="engineer">engineer</option>
                <option value="checker">checker</option>
                <option value="admin">admin</option>
              </select>
            </label>
            <button type="submit" disabled={busy} className="rounded bg-accent px-3 py-1.5 font-semibold text-white disabled:opacity-60">
              {busy ? 'Sending…' : 'Send invitation'}
            </button>
          </form>
          <DataTable<InvitationRow> endpoint={`/api/teams/${teamId}/invitations`} columns={invitationColumns} defaultSort="-createdAt" filterHint="e-mail" caption="Invitations" empty="No invitations sent yet." reloadKey={reload} rowKey={(r) => r.id} testId="invitations-table" pageSize={10} />
        </section>
      ) : null}

      <section aria-labelledby="shares-h" className="space-y-3">
        <h2 id="shares-h" className="text-lg font-semibold">Share links</h2>
        <p className="text-sm text-ink-soft">Read-only links to issued revisions, for architects and clients. Make one from a revision’s history page.</p>
        <DataTable<ShareRow> endpoint={`/api/teams/${teamId}/shares`} columns={shareColumns} defaultSort="-createdAt" filterHint="label, assembly or job" caption="Share links" empty="No share links yet." reloadKey={reload} rowKey={(r) => r.id} testId="shares-table" pageSize={10} />
      </section>

      {isAdmin ? (
        <section aria-labelledby="audit-h" className="space-y-3">
          <h2 id="audit-h" className="text-lg font-semibold">Audit log</h2>
          <p className="text-sm text-ink-soft">Sign-ins and failed sign-ins of the team’s members, role changes, invitations and share links made, opened and revoked.</p>
          <DataTable<AuditRow> endpoint={`/api/audit?teamId=${teamId}`} columns={auditColumns} defaultSort="-createdAt" filterHint="action, person, target or IP" caption="Audit log" empty="Nothing recorded yet." reloadKey={reload} rowKey={(r) => r.id} testId="audit-table" pageSize={25} />
        </section>
      ) : null}
    </div>
  );
}
