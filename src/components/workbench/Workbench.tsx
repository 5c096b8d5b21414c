import { useCallback, useEffect, useRef, useState } from 'react';
import { selectHasInvalidDrafts, useWorkbench, type AssemblyInfo, type RevisionInfo } from '../../lib/workbench/store';
import { workbenchDocumentSchema, type WorkbenchDocument } from '../../lib/schemas/workbench';
import { clearDraft, readDraft, writeDraft, type StoredDraft } from '../../lib/workbench/draftStorage';
import { diffBuildUps, type BuildUpDiff } from '../../lib/workbench/diff';
import BuildUpPane from './BuildUpPane';
import ExposurePane from './ExposurePane';
import ResponsePane from './ResponsePane';
import MoisturePane from './moisture/MoisturePane';
import SaveDialog from './SaveDialog';
import StaleDialog from './StaleDialog';

interface HeadJson {
  id: number;
  number: number;
  state: string;
  note: string;
  model: unknown;
  authorName: string | null;
  createdAt: string;
}

interface AssemblyJson {
  assembly: AssemblyInfo;
  head: HeadJson | null;
  role: 'admin' | 'engineer' | 'checker';
}

export interface StaleInfo {
  head: HeadJson;
  headDoc: WorkbenchDocument | null;
  diff: BuildUpDiff | null;
  message: string;
  note: string;
}

const STATE_WORDS: Record<string, string> = { draft: 'draft', in_check: 'in check', checked: 'checked', sent_back: 'sent back', issued: 'issued' };

const revisionInfo = (h: HeadJson): RevisionInfo => ({ id: h.id, number: h.number, state: h.state, note: h.note ?? '', authorName: h.authorName, createdAt: String(h.createdAt) });

/** a new assembly's document: no layers yet, the default exposure */
function blankDocument(): WorkbenchDocument {
  return { ...useWorkbench.getState().doc, layers: [] };
}

/** the assembly workbench: top bar, and the Build-up, Exposure, Response and Moisture panes */
export default function Workbench({ assemblyId }: { assemblyId: number }) {
  const [status, setStatus] = useState<'loading' | 'ready' | 'error'>('loading');
  const [loadError, setLoadError] = useState('');
  const [role, setRole] = useState<AssemblyJson['role']>('checker');
  const [offer, setOffer] = useState<StoredDraft | null>(null);
  const [saving, setSaving] = useState(false);
  const [saveOpen, setSaveOpen] = useState(false);
  const [saveError, setSaveError] = useState('');
  const [stale, setStale] = useState<StaleInfo | null>(null);
  const [savedNote, setSavedNote] = useState('');
  const assembly = useWorkbench((s) => s.assembly);
  const base = useWorkbench((s) => s.base);
  const dirty = useWorkbench((s) => s.dirty);
  const canUndo = useWorkbench((s) => s.past.length > 0);
  const canRedo = useWorkbench((s) => s.future.length > 0);
  const undo = useWorkbench((s) => s.undo);
  const redo = useWorkbench((s) => s.redo);
  const readOnly = role === 'checker';
  const loadedFor = useRef<number | null>(null);

  // load the assembly and its newest revision
  useEffect(() => {
    let live = true;
    (async () => {
      try {
        const r = await fetch(`/api/assemblies/${assemblyId}`, { headers: { accept: 'application/json' } });
        const body = (await r.json().catch(() => null)) as (AssemblyJson & { error?: { message: string } }) | null;
        if (!r.ok || !body) throw new Error(body?.error?.message ?? `The assembly could not be loaded (HTTP ${r.status}).`);
        if (!live) return;
        let doc = blankDocument();
        if (body.head) {
          const parsed = workbenchDocumentSchema.safeParse(body.head.model);
          if (!parsed.success) throw new Error(`Revision ${body.head.number} does not hold a valid build-up: ${parsed.error.issues[0]?.message ?? 'unknown problem'}.`);
          doc = parsed.data;
        }
        useWorkbench.getState().load({ assembly: body.assembly, base: body.head ? revisionInfo(body.head) : null, doc });
        setRole(body.role);
        loadedFor.current = assemblyId;
        const kept = readDraft(assemblyId, body.head?.id ?? null);
        if (kept && JSON.stringify(kept.doc) !== JSON.stringify(doc) && body.role !== 'checker') setOffer(kept);
        setStatus('ready');
      } catch (e) {
        if (!live) return;
        setLoadError((e as Error).message);
        setStatus('error');
      }
    })();
    return () => {
      live = false;
    };
  }, [assemblyId]);

  // keep unsaved work in this browser, keyed by the revision it started from
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | null = null;
    const unsubscribe = useWorkbench.subscribe((s, prev) => {
      if (loadedFor.current !== assemblyId || (s.doc === prev.doc && s.dirty === prev.dirty)) return;
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => {
        const now = useWorkbench.getState();
        if (now.dirty) writeDraft(assemblyId, now.base?.id ?? null, now.doc);
        else clearDraft(assemblyId, now.base?.id ?? null);
      }, 300);
    });
    return () => {
      unsubscribe();
      if (timer) clearTimeout(timer);
    };
  }, [assemblyId]);

  // warn before leaving with unsaved changes
  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      const s = useWorkbench.getState();
      if (!s.dirty) return;
      writeDraft(assemblyId, s.base?.id ?? null, s.doc);
      e.preventDefault();
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [assemblyId]);

  // Ctrl+Z / Ctrl+Shift+Z (and Ctrl+Y) anywhere on the page: the workbench's own history, also inside fields
  useEffect(() => {
    if (readOnly) return;
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
      if (document.querySelector('[role="dialog"]')) return;
      const k = e.key.toLowerCase();
      if (k === 'z' && !e.shiftKey) {
        e.preventDefault();
        useWorkbench.getState().undo();
      } else if ((k === 'z' && e.shiftKey) || k === 'y') {
        e.preventDefault();
        useWorkbench.getState().redo();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [readOnly]);

  const save = useCallback(
    async (note: string, onTopOf?: HeadJson) => {
      const s = useWorkbench.getState();
      setSaveError('');
      if (selectHasInvalidDrafts(s)) {
        setSaveError('Some fields hold text that is not a valid value (marked in red). Correct them or undo, then save.');
        return;
      }
      const parsed = workbenchDocumentSchema.safeParse(s.doc);
      if (!parsed.success) {
        const issue = parsed.error.issues[0];
        setSaveError(`The build-up cannot be saved: ${issue.path.join('.') || 'document'} ${issue.message}.`);
        return;
      }
      setSaving(true);
      try {
        const baseRevisionId = onTopOf ? onTopOf.id : (s.base?.id ?? null);
        const r = await fetch(`/api/assemblies/${assemblyId}/revisions`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', accept: 'application/json' },
          body: JSON.stringify({ baseRevisionId, model: parsed.data, note }),
        });
        const body = (await r.json().catch(() => null)) as {
          revision?: { id: number; number: number; state: string; createdAt: string };
          error?: { code: string; message: string; fields?: Record<string, string> };
          head?: HeadJson;
        } | null;
        if (r.status === 201 && body?.revision) {
          clearDraft(assemblyId, s.base?.id ?? null);
          useWorkbench.getState().markSaved({ ...body.revision, note, authorName: null, createdAt: String(body.revision.createdAt) });
          clearDraft(assemblyId, body.revision.id);
          setSaveOpen(false);
          setStale(null);
          setSavedNote(`Saved as revision ${body.revision.number}.`);
          return;
        }
        if (r.status === 409 && body?.head) {
          const headDoc = workbenchDocumentSchema.safeParse(body.head.model);
          setStale({
            head: body.head,
            headDoc: headDoc.success ? headDoc.data : null,
            diff: headDoc.success ? diffBuildUps(parsed.data, headDoc.data) : null,
            message: body.error?.message ?? 'Someone saved a newer revision.',
            note,
          });
          setSaveOpen(false);
          return;
        }
        const fields = body?.error?.fields ? Object.entries(body.error.fields).map(([k, v]) => `${k} ${v}`).join('; ') : '';
        setSaveError(`${body?.error?.message ?? `Saving failed (HTTP ${r.status}).`}${fields ? ` ${fields}` : ''} Your changes are still here and kept in this browser.`);
      } catch {
        setSaveError('The server could not be reached. Your changes are still here and kept in this browser; try again.');
      } finally {
        setSaving(false);
      }
    },
    [assemblyId],
  );

  if (status === 'loading') {
    return (
      <p className="py-10 text-center text-ink-soft" role="status">
        Opening the assembly…
      </p>
    );
  }
  if (status === 'error' || !assembly) {
    return (
      <div role="alert" className="rounded border border-danger/40 bg-danger-soft px-4 py-3 text-danger">
        {loadError || 'The assembly could not be opened.'}
      </div>
    );
  }

  const revisionLabel = base ? `Revision ${base.number}` : 'No revision saved yet';
  return (
    <div className="space-y-3" data-testid="workbench">
      <header className="flex flex-wrap items-center gap-x-4 gap-y-2 rounded-md border border-line bg-panel px-4 py-2">
        <div className="min-w-0">
          <a href={`/jobs/${assembly.jobId}`} className="text-xs text-accent hover:underline">
            ← {assembly.jobName}
          </a>
          <h1 className="truncate text-xl font-semibold leading-tight" data-testid="assembly-name">
            {assembly.name}
          </h1>
        </div>
        <div className="flex items-center gap-2 text-sm">
          <span className="rounded bg-paper px-2 py-0.5 font-semibold tabular" data-testid="revision-label">
            {revisionLabel}
          </span>
          {base ? <span className="rounded border border-line px-2 py-0.5 text-xs text-ink-soft">{STATE_WORDS[base.state] ?? base.state}</span> : null}
          {dirty ? (
            <span className="flex items-center gap-1 text-xs font-semibold text-warn" data-testid="unsaved">
              <span className="inline-block h-2 w-2 rounded-full bg-warn" aria-hidden="true" />
              Unsaved changes
            </span>
          ) : savedNote ? (
            <span className="text-xs text-ok" role="status">
              {savedNote}
            </span>
          ) : null}
        </div>
        <div className="ml-auto flex items-center gap-2">
          {readOnly ? (
            <span className="text-sm text-ink-soft">Read only: your role (checker) reviews and comments; engineers and admins edit.</span>
          ) : (
            <>
              <button
                type="button"
                onClick={undo}
                disabled={!canUndo}
                aria-keyshortcuts="Control+Z"
                title="Undo (Ctrl+Z)"
                className="rounded border border-line px-3 py-1.5 text-sm enabled:hover:border-accent disabled:opacity-40"
              >
                Undo
              </button>
              <button
                type="button"
                onClick={redo}
                disabled={!canRedo}
                aria-keyshortcuts="Control+Shift+Z"
                title="Redo (Ctrl+Shift+Z)"
                className="rounded border border-line px-3 py-1.5 text-sm enabled:hover:border-accent disabled:opacity-40"
              >
                Redo
              </button>
              <button
                type="button"
                onClick={() => {
                  setSaveError('');
                  setSaveOpen(true);
                }}
                disabled={saving}
                className="rounded bg-accent px-4 py-1.5 text-sm font-semibold text-white hover:bg-accent-strong disabled:opacity-50"
                data-testid="save"
              >
                Save…
              </button>
            </>
          )}
        </div>
      </header>

      {offer ? (
        <div role="alert" className="flex flex-wrap items-center gap-3 rounded border border-warn/40 bg-warn-soft px-4 py-2 text-sm">
          <span>
            Unsaved changes from {new Date(offer.savedAt).toLocaleString('en-GB')} were kept in this browser for {revisionLabel.toLowerCase()}.
          </span>
          <button
            type="button"
            className="rounded bg-accent px-3 py-1 font-semibold text-white"
            onClick={() => {
              const s = useWorkbench.getState();
              s.load({ assembly: s.assembly, base: s.base, doc: offer.doc, saved: s.savedDoc });
              setOffer(null);
            }}
          >
            Restore them
          </button>
          <button
            type="button"
            className="rounded border border-line-strong px-3 py-1"
            onClick={() => {
              clearDraft(assemblyId, base?.id ?? null);
              setOffer(null);
            }}
          >
            Discard
          </button>
        </div>
      ) : null}

      {saveError && !saveOpen ? (
        <div role="alert" className="rounded border border-danger/40 bg-danger-soft px-4 py-2 text-sm text-danger">
          {saveError}
        </div>
      ) : null}

      <div className="grid gap-4">
        <div className="rounded-md border border-line bg-paper p-3">
          <BuildUpPane readOnly={readOnly} />
        </div>
        {
          // panes: exposure and response mount here
        }
        <div className="grid gap-4 xl:grid-cols-[minmax(0,24rem)_minmax(0,1fr)] items-start">
          <div className="rounded-md border border-line bg-paper p-3">
            <ExposurePane readOnly={readOnly} />
          </div>
          <div className="rounded-md border border-line bg-paper p-3 min-w-0">
            <ResponsePane mode={readOnly ? 'checker' : 'edit'} />
          </div>
        </div>
        <div className="rounded-md border border-line bg-paper p-3 min-w-0">
          <MoisturePane readOnly={readOnly} />
        </div>
      </div>

      {saveOpen ? (
        <SaveDialog
          nextNumber={(base?.number ?? 0) + 1}
          saving={saving}
          error={saveError}
          onCancel={() => setSaveOpen(false)}
          onSave={(note) => save(note)}
        />
      ) : null}
      {stale ? (
        <StaleDialog
          stale={stale}
          saving={saving}
          error={saveError}
          onSaveOnTop={() => save(stale.note, stale.head)}
          onKeepEditing={() => setStale(null)}
        />
      ) : null}
    </div>
  );
}
