// unsaved work survives a reload: the document is kept in localStorage under the assembly and
// the revision it was opened from, and offered back when that same revision is opened again
import { workbenchDocumentSchema, type WorkbenchDocument } from '../schemas/workbench';

export interface StoredDraft {
  doc: WorkbenchDocument;
  /** ISO time */
  savedAt: string;
}

export const draftStorageKey = (assemblyId: number, baseRevisionId: number | null) => `wallpulse:draft:${assemblyId}:${baseRevisionId ?? 'none'}`;

export function readDraft(assemblyId: number, baseRevisionId: number | null): StoredDraft | null {
  try {
    const raw = localStorage.getItem(draftStorageKey(assemblyId, baseRevisionId));
    if (!raw) return null;
    const parsed = JSON.parse(raw) as { doc?: unknown; savedAt?: unknown };
    // only a whole, valid document is offered back (a stack emptied of every layer is not)
    const doc = workbenchDocumentSchema.safeParse(parsed.doc);
    if (!doc.success || typeof parsed.savedAt !== 'string') return null;
    return { doc: doc.data, savedAt: parsed.savedAt };
  } catch {
    return null;
  }
}

export function writeDraft(assemblyId: number, baseRevisionId: number | null, doc: WorkbenchDocument): void {
  try {
    localStorage.setItem(draftStorageKey(assemblyId, baseRevisionId), JSON.stringify({ doc, savedAt: new Date().toISOString() }));
  } catch {
    // storage full or blocked: the page still works, only the reload safety net is gone
  }
}

export function clearDraft(assemblyId: number, baseRevisionId: number | null): void {
  try {
    localStorage.removeItem(draftStorageKey(assemblyId, baseRevisionId));
  } catch {
    // nothing to do
  }
}
