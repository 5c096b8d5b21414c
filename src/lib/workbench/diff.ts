// what differs between two build-ups, in words a person can act on (used when a save meets a newer revision)
import type { DocLayer, WorkbenchDocument } from '../schemas/workbench';

export interface LayerChange {
  name: string;
  /** the labels of the fields that differ */
  fields: string[];
}

export interface BuildUpDiff {
  added: string[];
  removed: string[];
  changed: LayerChange[];
  /** the same layers in another order */
  reordered: boolean;
  exposureChanged: boolean;
}

const FIELD_LABELS: [keyof DocLayer, string][] = [
  ['name', 'name'],
  ['materialClass', 'class'],
  ['thickness', 'thickness'],
  ['conductivity', 'conductivity'],
  ['density', 'density'],
  ['specificHeat', 'specific heat'],
  ['vapourResistanceFactor', 'μ'],
];

/** what `theirs` has that `mine` does not, and the other way round, matched by card id */
export function diffBuildUps(mine: WorkbenchDocument, theirs: WorkbenchDocument): BuildUpDiff {
  const mineById = new Map(mine.layers.map((l) => [l.id, l]));
  const theirsById = new Map(theirs.layers.map((l) => [l.id, l]));
  const added = theirs.layers.filter((l) => !mineById.has(l.id)).map((l) => l.name);
  const removed = mine.layers.filter((l) => !theirsById.has(l.id)).map((l) => l.name);
  const changed: LayerChange[] = [];
  for (const t of theirs.layers) {
    const m = mineById.get(t.id);
    if (!m) continue;
    const fields = FIELD_LABELS.filter(([k]) => m[k] !== t[k]).map(([, label]) => label);
    if (fields.length) changed.push({ name: t.name, fields });
  }
  const common = (a: DocLayer[], other: Map<string, DocLayer>) => a.filter((l) => other.has(l.id)).map((l) => l.id).join('|');
  return {
    added,
    removed,
    changed,
    reordered: common(mine.layers, theirsById) !== common(theirs.layers, mineById),
    exposureChanged: JSON.stringify(mine.exposure) !== JSON.stringify(theirs.exposure),
  };
}
