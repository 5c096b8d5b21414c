// the workbench island's single source of truth: the whole workbench document (layers and
// exposure), where it came from, the text being typed into fields, and an undo history.
// the document only ever holds valid values: a field being typed keeps its raw text and its
// message in `drafts` while the model keeps the last valid value, so the figures keep running.
import { create } from 'zustand';
import { analyse, type Figures } from '../thermal/index.ts';
import type { ModelInput } from '../schemas/model';
import { defaultExposure, toModel, type DocLayer, type Exposure, type Indoor, type Outdoor, type UploadedSeries, type WorkbenchDocument } from '../schemas/workbench';
import { materialRef, startingThickness, type LibraryMaterial } from '../materials/library';
import { draftKey, parseLayerField, type LayerField } from './fields';

/** undo steps kept; the oldest fall off */
export const HISTORY_LIMIT = 100;

export interface FieldDraft {
  /** what the person typed */
  raw: string;
  /** why it is not in the model, or null while it is valid */
  error: string | null;
}

export interface RevisionInfo {
  id: number;
  number: number;
  state: string;
  note: string;
  authorName: string | null;
  createdAt: string;
}

export interface AssemblyInfo {
  id: number;
  name: string;
  element: string;
  description: string;
  jobId: number;
  jobName: string;
  teamId: number;
}

export interface WorkbenchState {
  assembly: AssemblyInfo | null;
  /** the revision the document was opened from (or last saved as); null for an assembly with none yet */
  base: RevisionInfo | null;
  doc: WorkbenchDocument;
  /** the document as last loaded or saved; dirty = doc differs from it */
  savedDoc: WorkbenchDocument;
  dirty: boolean;
  /** keyed by draftKey(layerId, field) or any key a pane chooses (e.g. "exposure:mean") */
  drafts: Record<string, FieldDraft>;
  past: WorkbenchDocument[];
  future: WorkbenchDocument[];
  /** the field the last edit went to: further typing there joins the same undo step */
  editingKey: string | null;
  /** the uploaded outdoor series when the exposure uses one */
  upload: UploadedSeries | null;
  /** the layer under the pointer or focus, in the cards or the drawing (view state, not undoable) */
  highlightedId: string | null;
  setHighlighted(id: string | null): void;

  load(input: { assembly: AssemblyInfo | null; base: RevisionInfo | null; doc: WorkbenchDocument; saved?: WorkbenchDocument }): void;
  markSaved(base: RevisionInfo): void;
  setUpload(upload: UploadedSeries | null): void;

  addLayer(material: LibraryMaterial, index?: number): string;
  duplicateLayer(id: string): string | null;
  removeLayer(id: string): void;
  moveLayer(fromIndex: number, toIndex: number): void;
  /** edit one field with the text typed; returns the message when the text is not valid */
  editField(id: string, field: LayerField, raw: string): string | null;
  /** typing in a field is over: the next edit starts a new undo step; a valid draft is dropped, a bad one stays with its message */
  endEdit(key?: string): void;

  setExposure(patch: Partial<Exposure>): void;
  setOutdoor(outdoor: Outdoor): void;
  setIndoor(indoor: Indoor): void;
  /** for panes with their own fields: keep typed text and its message (null error = valid) */
  setDraft(key: string, raw: string, error: string | null): void;
  clearDraft(key: string): void;

  undo(): void;
  redo(): void;
}

let counter = 0;
/** a card id unique in this page's life; stable across reorders */
export function newLayerId(): string {
  counter += 1;
  return `l${Date.now().toString(36)}${counter.toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
}

const emptyDoc = (): WorkbenchDocument => ({
  version: 2,
  layers: [],
  exposure: defaultExposure(),
});

export const useWorkbench = create<WorkbenchState>()((set, get) => {
  /** replace the document as one undo step (or join the current one when `key` matches the last edit) */
  const commit = (next: WorkbenchDocument, key: string | null = null, extra: Partial<WorkbenchState> = {}) => {
    const s = get();
    const joins = key !== null && key === s.editingKey && s.past.length > 0;
    const past = joins ? s.past : [...s.past, s.doc].slice(-HISTORY_LIMIT);
    set({ doc: next, past, future: [], editingKey: key, dirty: next !== s.savedDoc, ...extra });
  };
  const withLayers = (layers: DocLayer[]): WorkbenchDocument => ({ ...get().doc, layers });
  const dropLayerDrafts = (drafts: Record<string, FieldDraft>, id: string) => {
    const prefix = `layer:${id}:`;
    const out: Record<string, FieldDraft> = {};
    for (const [k, v] of Object.entries(drafts)) if (!k.startsWith(prefix)) out[k] = v;
    return out;
  };

  return {
    assembly: null,
    base: null,
    doc: emptyDoc(),
    savedDoc: emptyDoc(),
    dirty: false,
    drafts: {},
    past: [],
    future: [],
    editingKey: null,
    upload: null,
    highlightedId: null,
    setHighlighted(id) {
      if (get().highlightedId !== id) set({ highlightedId: id });
    },

    load({ assembly, base, doc, saved }) {
      const savedDoc = saved ?? doc;
      set({ assembly, base, doc, savedDoc, dirty: doc !== savedDoc, drafts: {}, past: [], future: [], editingKey: null });
    },
    markSaved(base) {
      set((s) => ({ base, savedDoc: s.doc, dirty: false, editingKey: null }));
    },
    setUpload(upload) {
      set({ upload });
    },

    addLayer(material, index) {
      const layers = get().doc.layers;
      const layer: DocLayer = {
        id: newLayerId(),
        name: material.name,
        materialRef: materialRef(material),
        materialClass: material.materialClass,
        thickness: startingThickness(material),
        conductivity: material.conductivity,
        density: material.density,
        specificHeat: material.specificHeat,
        vapourResistanceFactor: material.vapourResistanceFactor,
        source: material.source,
        note: material.notes,
      };
      const at = index === undefined ? layers.length : Math.max(0, Math.min(index, layers.length));
      commit(withLayers([...layers.slice(0, at), layer, ...layers.slice(at)]));
      return layer.id;
    },
    duplicateLayer(id) {
      const layers = get().doc.layers;
      const i = layers.findIndex((l) => l.id === id);
      if (i < 0) return null;
      const copy: DocLayer = { ...layers[i], id: newLayerId() };
      commit(withLayers([...layers.slice(0, i + 1), copy, ...layers.slice(i + 1)]));
      return copy.id;
    },
    removeLayer(id) {
      const layers = get().doc.layers;
      if (!layers.some((l) => l.id === id)) return;
      commit(
        withLayers(layers.filter((l) => l.id !== id)),
        null,
        { drafts: dropLayerDrafts(get().drafts, id) },
      );
    },
    moveLayer(fromIndex, toIndex) {
      const layers = get().doc.layers;
      if (fromIndex === toIndex || fromIndex < 0 || toIndex < 0 || fromIndex >= layers.length || toIndex >= layers.length) return;
      const next = layers.slice();
      const [moved] = next.splice(fromIndex, 1);
      next.splice(toIndex, 0, moved);
      commit(withLayers(next));
    },
    editField(id, field, raw) {
      const s = get();
      const i = s.doc.layers.findIndex((l) => l.id === id);
      if (i < 0) return null;
      const key = draftKey(id, field);
      const parsed = parseLayerField(field, raw);
      if (!parsed.ok) {
        set({ drafts: { ...s.drafts, [key]: { raw, error: parsed.error } } });
        return parsed.error;
      }
      const layer = s.doc.layers[i];
      const drafts = { ...s.drafts, [key]: { raw, error: null } };
      if (layer[field] === parsed.value) {
        set({ drafts });
        return null;
      }
      const edited: DocLayer = { ...layer, [field]: parsed.value };
      // a changed material property no longer matches the library entry it came from
      if (field === 'conductivity' || field === 'density' || field === 'specificHeat' || field === 'vapourResistanceFactor') {
        edited.materialRef = null;
      }
      const layers = s.doc.layers.slice();
      layers[i] = edited;
      commit(withLayers(layers), key, { drafts });
      return null;
    },
    endEdit(key) {
      const s = get();
      if (key === undefined) {
        set({ editingKey: null });
        return;
      }
      const drafts = { ...s.drafts };
      if (drafts[key] && drafts[key].error === null) delete drafts[key];
      set({ editingKey: s.editingKey === key ? null : s.editingKey, drafts });
    },

    setExposure(patch) {
      const doc = get().doc;
      commit({ ...doc, exposure: { ...doc.exposure, ...patch } });
    },
    setOutdoor(outdoor) {
      const doc = get().doc;
      commit({ ...doc, exposure: { ...doc.exposure, outdoor } });
    },
    setIndoor(indoor) {
      const doc = get().doc;
      commit({ ...doc, exposure: { ...doc.exposure, indoor } });
    },
    setDraft(key, raw, error) {
      set((s) => ({ drafts: { ...s.drafts, [key]: { raw, error } } }));
    },
    clearDraft(key) {
      set((s) => {
        const drafts = { ...s.drafts };
        delete drafts[key];
        return { drafts };
      });
    },

    undo() {
      const s = get();
      const prev = s.past[s.past.length - 1];
      if (!prev) return;
      set({
        doc: prev,
        past: s.past.slice(0, -1),
        future: [s.doc, ...s.future],
        drafts: {},
        editingKey: null,
        dirty: prev !== s.savedDoc,
      });
    },
    redo() {
      const s = get();
      const next = s.future[0];
      if (!next) return;
      set({
        doc: next,
        past: [...s.past, s.doc].slice(-HISTORY_LIMIT),
        future: s.future.slice(1),
        drafts: {},
        editingKey: null,
        dirty: next !== s.savedDoc,
      });
    },
  };
});

// --- selectors ---

let modelCache: { doc: WorkbenchDocument; upload: UploadedSeries | null; model: ModelInput | null } | null = null;

/**
 * the engine model of the document (toModel), memoised on the document; null while there is
 * no layer, or the exposure uses an uploaded series that is not loaded yet
 */
export function selectModel(state: Pick<WorkbenchState, 'doc' | 'upload'>): ModelInput | null {
  if (modelCache && modelCache.doc === state.doc && modelCache.upload === state.upload) return modelCache.model;
  let model: ModelInput | null = null;
  if (state.doc.layers.length > 0 && (state.doc.exposure.outdoor.mode !== 'series' || state.upload)) {
    model = toModel(state.doc, state.upload ?? undefined);
  }
  modelCache = { doc: state.doc, upload: state.upload, model };
  return model;
}

let figuresCache: { layers: DocLayer[]; exposure: Exposure; figures: Figures | null } | null = null;

/**
 * the live figures of analyse() (steady, per layer, lumped, ISO 13786 periodic), memoised on the
 * layers and the exposure. needs no upload: a series exposure is analysed at the default one-day period.
 */
export function selectFigures(state: Pick<WorkbenchState, 'doc'>): Figures | null {
  const { layers, exposure } = state.doc;
  if (figuresCache && figuresCache.layers === layers && figuresCache.exposure === exposure) return figuresCache.figures;
  let figures: Figures | null = null;
  if (layers.length > 0) {
    const out = exposure.outdoor;
    figures = analyse({
      layers,
      outside: {
        surfaceResistance: exposure.outsideSurfaceResistance,
        air: out.mode === 'series' ? { kind: 'constant', value: 0 } : { kind: 'sine', mean: out.mean, amplitude: out.amplitude, period: 86400, peakTime: out.peakHour * 3600 },
      },
      inside: { surfaceResistance: exposure.insideSurfaceResistance, air: { kind: 'constant', value: 20 } },
      mesh: { maxCellSize: exposure.maxCellSize, minCellsPerLayer: 4 },
    });
  }
  figuresCache = { layers, exposure, figures };
  return figures;
}

/** any field holding text that is not in the model */
export function selectHasInvalidDrafts(state: Pick<WorkbenchState, 'drafts'>): boolean {
  return Object.values(state.drafts).some((d) => d.error !== null);
}
