import { useCallback, useEffect, useState, type SubmitEvent } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import DataTable from '../team/DataTable';
import StateBadge from '../team/StateBadge';
import { errorOf, formatWhen, send, STATE_LABEL } from '../team/format';
import type * as rows from '../../lib/schemas/rows';
import type { RevisionState, Role, Wire } from '../../lib/schemas/rows';
import type { RevisionInfo } from '../../lib/workbench/store';
import { summaryRows } from '../../lib/workbench/figureDefs';
import CautionNote from '../CautionNote';
import RevokeDialog from './RevokeDialog';

/** a state a revision may be moved to */
type Target = RevisionState;

type RevisionRow = Wire<rows.RevisionRow>;
interface Detail {
  revision: RevisionInfo;
  events: { id: number; fromState: string | null; toState: string; note: string; actorName: string | null; createdAt: string }[];
  comments: { id: number; body: string; authorName: string | null; createdAt: string }[];
  moves: Target[];
}
interface RunRow {
  id: number;
  summary: Record<string, number | string | null>;
  createdByName: string | null;
  createdAt: string;
  hasSeries: boolean;
}
type ShareRow = Wire<rows.ShareRow>;

const MOVE_TEXT: Record<Target, { label: string; hint: string; tone: string }> = {
  in_check: { label: 'Send to check', hint: 'A checker reads it, comments, and marks it checked or sends it back.', tone: 'bg-accent text-white' },
  checked: { label: 'Mark checked', hint: 'You have checked this revision; the engineer may then issue it.', tone: 'bg-accent text-white' },
  sent_back: { label: 'Send back', hint: 'Say what needs to change (a note is required).', tone: 'border border-danger text-danger bg-panel' },
  issued: { label: 'Issue', hint: 'Issuing freezes the revision and lets you share it with a guest.', tone: 'bg-ok text-white' },
  draft: { label: 'Back to draft', hint: 'Withdraw it from the check to keep working.', tone: 'border border-line bg-panel' },
};

const columns: ColumnDef<RevisionRow>[] = [
  { id: 'number', header: 'Revision', meta: { align: 'right' }, cell: ({ row }) => <span className="font-semibold">R{row.original.number}</span> },
  { id: 'state', header: 'State', cell: ({ row }) => <StateBadge state={row.original.state} /> },
  { id: 'authorName', header: 'Saved by', cell: ({ row }) => row.original.authorName ?? '—' },
  { id: 'createdAt', header: 'When', cell: ({ row }) => formatWhen(row.original.createdAt) },
  { id: 'note', header: 'Note', enableSorting: false, cell: ({ row }) => <span className="text-ink-soft">{row.original.note || '—'}</span> },
  { id: 'runs', header: 'Runs', enableSorting: false, meta: { align: 'right' }, cell: ({ row }) => row.original.runCount },
  { id: 'comments', header: 'Comments', enableSorting: false, meta: { align: 'right' }, cell: ({ row }) => row.original.commentCount },
];

/** the revision history of an assembly: states with who and when, comments, check actions, runs and share links */
export default function ReviewScreen({ assemblyId, role, initialRevisionId }: { assemblyId: number; role: Role; initialRevisionId: number | null }) {
  const [selected, setSelected] = useState<number | null>(initialRevisionId);
  const [detail, setDetail] = useState<Detail | null>(null);
  const [runs, setRuns] = useState<RunRow[]>([]);
  const [shares, setShares] = useState<ShareRow[]>([]);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [reload, setReload] = useState(0);
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [shareLabel, setShareLabel] = useState('');
  const [shareDays, setShareDays] = useState('30');
  const [shareError, setShareError] = useState<string | null>(null);
  const [newUrl, setNewUrl] = useState<string | null>(null);
  const canEdit = role === 'admin' || role === 'engineer';
  /** the share link the revoke dialog asks about */
  const [revoking, setRevoking] = useState<ShareRow | null>(null);

  // with no revision asked for, show the newest
  useEffect(() => {
    if (selected !== null) return;
    fetch(`/api/assemblies/${assemblyId}`)
      .then(async (r) => (r.ok ? ((await r.json()) as { head: { id: number } | null }) : Promise.reject(new Error((await errorOf(r)).message))))
      .then((b) => b.head && setSelected(b.head.id))
      .catch((e: Error) => setLoadError(e.message));
  }, [assemblyId, selected]);

  const load = useCallback(async (id: number) => {
    const [d, r, s] = await Promise.all([fetch(`/api/revisions/${id}`), fetch(`/api/revisions/${id}/runs`), fetch(`/api/revisions/${id}/shares?pageSize=50`)]);
    if (!d.ok) {
      setLoadError((await errorOf(d)).message);
      return;
    }
    setLoadError(null);
    setDetail((await d.json()) as Detail);
    setRuns(r.ok ? ((await r.json()) as { items: RunRow[] }).items : []);
    setShares(s.ok ? ((await s.json()) as { items: ShareRow[] }).items : []);
  }, []);

  useEffect(() => {
    if (selected === null) return;
    void load(selected);
    const url = new URL(window.location.href);
    url.searchParams.set('rev', String(selected));
    window.history.replaceState(null, '', url);
  }, [selected, reload, load]);

  function pick(row: RevisionRow) {
    setSelected(row.id);
    setNewUrl(null);
    setActionError(null);
    setNote('');
  }

  async function move(to: Target) {
    if (!detail) return;
    if (to === 'sent_back' && !note.trim()) {
      setNoteError('Note is required when sending a revision back: say what needs to change.');
      return;
    }
    setBusy(true);
    const res = await send('POST', `/api/revisions/${detail.revision.id}/transitions`, { to, note });
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setActionError(err.message);
      setNoteError(err.fields.note ?? null);
      return;
    }
    setNote('');
    setNoteError(null);
    setActionError(null);
    setReload((n) => n + 1);
  }

  async function addComment(e: SubmitEvent) {
    e.preventDefault();
    if (!detail) return;
    if (!comment.trim()) {
      setCommentError('Comment must not be empty');
      return;
    }
    setBusy(true);
    const res = await send('POST', `/api/revisions/${detail.revision.id}/comments`, { body: comment });
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setCommentError(err.fields.body ?? err.message);
      return;
    }
    setComment('');
    setCommentError(null);
    setReload((n) => n + 1);
  }

  async function makeShare(e: SubmitEvent) {
    e.preventDefault();
    if (!detail) return;
    const days = shareDays.trim() === '' ? null : Number(shareDays);
    if (days !== null && (!Number.isInteger(days) || days < 1 || days > 365)) {
      setShareError('Expires in must be a whole number of days from 1 to 365, or empty for no expiry');
      return;
    }
    setBusy(true);
    const res = await send('POST', `/api/revisions/${detail.revision.id}/shares`, { label: shareLabel, expiresInDays: days });
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setShareError(Object.values(err.fields)[0] ?? err.message);
      return;
    }
    const { share } = (await res.json()) as { share: { url: string } };
    setNewUrl(share.url);
    setShareError(null);
    setShareLabel('');
    setReload((n) => n + 1);
  }

  async function revoke(id: number) {
    setRevoking(null);
    const res = await send('POST', `/api/shares/${id}/revoke`);
    if (!res.ok) setShareError((await errorOf(res)).message);
    setReload((n) => n + 1);
  }

  const rev = detail?.revision;
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <section aria-labelledby="revisions-h" className="space-y-3">
        <h2 id="revisions-h" className="text-lg font-semibold">Revisions</h2>
        <DataTable<RevisionRow>
          endpoint={`/api/assemblies/${assemblyId}/revisions`}
          columns={columns}
          defaultSort="-number"
          filterHint="note, author or state"
          caption="Revisions"
          empty="No revisions yet."
          reloadKey={reload}
          rowKey={(r) => r.id}
          selectedKey={selected}
          onRowClick={pick}
          testId="revisions-table"
        />
        <p className="text-xs text-ink-soft">Each save of the workbench is a new revision; a revision never changes once saved, only its state moves. Pick one to see its history.</p>
      </section>

      <section aria-labelledby="detail-h" className="space-y-5" data-testid="revision-detail">
        {loadError ? <p role="alert" className="rounded border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">{loadError}</p> : null}
        {!rev ? (
          <p className="text-ink-faint">Loading the revision…</p>
        ) : (
          <>
            <div>
              <h2 id="detail-h" className="flex items-center gap-3 text-lg font-semibold">
                Revision {rev.number} <StateBadge state={rev.state} />
              </h2>
              <p className="text-sm text-ink-soft">
                Saved by {rev.authorName ?? 'a former member'}, {formatWhen(rev.createdAt)}
                {rev.note ? ` — “${rev.note}”` : ''}
              </p>
              <a href={`/assemblies/${assemblyId}`} className="text-sm text-accent-strong underline">Open the workbench</a>
            </div>

            {detail.moves.length > 0 ? (
              <div className="space-y-2 rounded border border-line bg-panel p-3" aria-label="Check actions">
                <h3 className="font-semibold">Check</h3>
                <label htmlFor="move-note" className="block text-sm">
                  <span className="text-ink-soft">Note (required to send back)</span>
                  <textarea
                    id="move-note"
                    rows={2}
                    value={note}
                    onChange={(e) => { setNote(e.target.value); setNoteError(null); }}
                    maxLength={2000}
                    aria-invalid={noteError ? true : undefined}
                    className={`mt-1 block w-full rounded border bg-panel px-2 py-1 ${noteError ? 'border-danger' : 'border-line'}`}
                  />
                  {noteError ? <span className="text-xs text-danger" role="alert">{noteError}</span> : null}
                </label>
                <div className="flex flex-wrap gap-2">
                  {detail.moves.map((m) => (
                    <button key={m} type="button" disabled={busy} title={MOVE_TEXT[m].hint} className={`rounded px-3 py-1.5 text-sm font-semibold disabled:opacity-60 ${MOVE_TEXT[m].tone}`} onClick={() => move(m)}>
                      {MOVE_TEXT[m].label}
                    </button>
                  ))}
                </div>
                {actionError ? <p className="text-sm text-danger" role="alert">{actionError}</p> : null}
              </div>
            ) : rev.state === 'issued' ? (
              <p className="text-sm text-ink-soft">Issued: this revision is frozen. Save a new revision in the workbench to change the build-up.</p>
            ) : (
              <p className="text-sm text-ink-soft">
                {rev.state === 'in_check' ? 'Waiting for a checker.' : rev.state === 'checked' ? 'Checked; an engineer or admin may issue it.' : 'Nothing for your role to do here.'}
              </p>
            )}

            <div>
              <h3 className="font-semibold">History</h3>
              <ol className="mt-2 space-y-2 border-l-2 border-line pl-3 text-sm" data-testid="history">
                {detail.events.map((ev) => (
                  <li key={ev.id}>
                    <span className="font-semibold">{ev.fromState ? `${STATE_LABEL[ev.fromState]} → ${STATE_LABEL[ev.toState]}` : STATE_LABEL[ev.toState]}</span>{' '}
                    <span className="text-ink-soft">by {ev.actorName ?? 'a former member'}, {formatWhen(ev.createdAt)}</span>
                    {ev.note ? <div className="text-ink-soft">“{ev.note}”</div> : null}
                  </li>
                ))}
              </ol>
            </div>

            <div>
              <h3 className="font-semibold">Comments</h3>
              {detail.comments.length === 0 ? <p className="mt-1 text-sm text-ink-faint">No comments yet.</p> : null}
              <ul className="mt-2 space-y-2" data-testid="comments">
                {detail.comments.map((c) => (
                  <li key={c.id} className="rounded border border-line bg-panel px-3 py-2 text-sm">
                    <div className="text-xs text-ink-soft">{c.authorName ?? 'a former member'}, {formatWhen(c.createdAt)}</div>
                    <div className="whitespace-pre-line">{c.body}</div>
                  </li>
                ))}
              </ul>
              <form onSubmit={addComment} className="mt-2 space-y-1" noValidate>
                <label htmlFor="comment" className="sr-only">Comment</label>
                <textarea
                  id="comment"
                  rows={2}
                  value={comment}
                  onChange={(e) => { setComment(e.target.value); setCommentError(null); }}
                  placeholder="Write a comment on this revision"
                  maxLength={5000}
                  aria-invalid={commentError ? true : undefined}
                  className={`block w-full rounded border bg-panel px-2 py-1 text-sm ${commentError ? 'border-danger' : 'border-line'}`}
                />
                {commentError ? <p className="text-xs text-danger" role="alert">{commentError}</p> : null}
                <button type="submit" disabled={busy} className="rounded border border-line bg-panel px-3 py-1 text-sm font-semibold">Add comment</button>
              </form>
            </div>

            <div>
              <h3 className="font-semibold">Runs</h3>
              {runs.length > 0 ? <div className="mt-1"><CautionNote compact /></div> : null}
              {runs.length === 0 ? <p className="mt-1 text-sm text-ink-faint">No runs stored for this revision. Run it in the workbench and keep the run.</p> : null}
              <ul className="mt-2 space-y-2 text-sm" data-testid="runs">
                {runs.map((r) => (
                  <li key={r.id} className="rounded border border-line bg-panel px-3 py-2">
                    <div className="text-xs text-ink-soft">{formatWhen(r.createdAt)}{r.createdByName ? ` by ${r.createdByName}` : ''}{r.hasSeries ? ' · with its series' : ' · figures only'}</div>
                    <dl className="mt-1 grid grid-cols-[auto_auto_auto] gap-x-3 gap-y-0.5">
                      {summaryRows(r.summary).map((f) => (
                        <div key={f.key} className="contents">
                          <dt className="text-ink-soft" title={f.how}>{f.label}</dt>
                          <dd className="tabular text-right">{f.value}</dd>
                          <dd className="text-ink-soft">{f.unit}</dd>
                        </div>
                      ))}
                    </dl>
                  </li>
                ))}
              </ul>
            </div>

            <div>
              <h3 className="font-semibold">Share links</h3>
              {rev.state !== 'issued' ? (
                <p className="mt-1 text-sm text-ink-soft">Only an issued revision can be shared with a guest. Have it checked, then issue it.</p>
              ) : canEdit ? (
                <form onSubmit={makeShare} className="mt-2 flex flex-wrap items-end gap-2 text-sm" noValidate aria-label="New share link">
                  <label htmlFor="share-label" className="block">
                    <span className="text-ink-soft">Label</span>
                    <input id="share-label" value={shareLabel} onChange={(e) => setShareLabel(e.target.value)} maxLength={160} placeholder="e.g. for the architect" className="mt-1 block w-48 rounded border border-line bg-panel px-2 py-1" />
                  </label>
                  <label htmlFor="share-days" className="block">
                    <span className="text-ink-soft">Expires in (days)</span>
                    <input id="share-days" inputMode="numeric" value={shareDays} onChange={(e) => setShareDays(e.target.value)} placeholder="never" className="mt-1 block w-24 rounded border border-line bg-panel px-2 py-1 tabular" />
                  </label>
                  <button type="submit" disabled={busy} className="rounded bg-accent px-3 py-1.5 font-semibold text-white">Make a share link</button>
                </form>
              ) : (
                <p className="mt-1 text-sm text-ink-soft">Engineers and admins make share links.</p>
              )}
              {shareError ? <p className="mt-1 text-sm text-danger" role="alert">{shareError}</p> : null}
              {newUrl ? (
                <div className="mt-2 rounded border border-ok/30 bg-ok/10 p-2 text-sm" role="status">
                  <p>Copy the link now: it is shown only this once (only a fingerprint of it is kept).</p>
                  <div className="mt-1 flex gap-2">
                    <input readOnly value={newUrl} data-testid="share-url" className="w-full rounded border border-line bg-panel px-2 py-1 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} />
                    <button type="button" className="rounded border border-line bg-panel px-2" onClick={() => void navigator.clipboard?.writeText(newUrl)}>Copy</button>
                  </div>
                </div>
              ) : null}
              {shares.length > 0 ? (
                <table className="mt-2 w-full text-sm">
                  <thead>
                    <tr className="text-left text-ink-soft border-b border-line">
                      <th className="py-1 pr-2 font-semibold">Label</th>
                      <th className="py-1 pr-2 font-semibold">Last opened</th>
                      <th className="py-1 pr-2 font-semibold text-right">Opens</th>
                      <th className="py-1 pr-2 font-semibold">Status</th>
                      <th></th>
                    </tr>
                  </thead>
                  <tbody>
                    {shares.map((s) => (
                      <tr key={s.id} className="border-b border-line/60">
                        <td className="py-1 pr-2">{s.label || '—'}</td>
                        <td className="py-1 pr-2">{s.lastOpenedAt ? formatWhen(s.lastOpenedAt) : 'not yet'}</td>
                        <td className="py-1 pr-2 text-right tabular">{s.openCount}</td>
                        <td className="py-1 pr-2">{s.status}{s.expiresAt && s.status === 'active' ? ` until ${formatWhen(s.expiresAt)}` : ''}</td>
                        <td className="py-1">{canEdit && s.status === 'active' ? <button type="button" className="text-danger hover:underline" onClick={() => setRevoking(s)}>Revoke</button> : null}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              ) : null}
            </div>
          </>
        )}
      </section>
      {revoking ? <RevokeDialog share={revoking} onCancel={() => setRevoking(null)} onConfirm={() => void revoke(revoking.id)} /> : null}
    </div>
  );
}
