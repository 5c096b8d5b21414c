import { describe, it, expect, beforeEach } from 'vitest';
import { useWorkbench, selectFigures, selectModel, HISTORY_LIMIT } from '../../../src/lib/workbench/store';
import { defaultExposure, type DocLayer, type WorkbenchDocument } from '../../../src/lib/schemas/workbench';
import type { LibraryMaterial } from '../../../src/lib/materials/library';
import { draftKey } from '../../../src/lib/workbench/fields';

const layer = (id: string, name: string, thickness: number, conductivity: number, density: number, specificHeat: number, cls: DocLayer['materialClass']): DocLayer => ({
  id,
  name,
  materialRef: null,
  materialClass: cls,
  thickness,
  conductivity,
  density,
  specificHeat,
  vapourResistanceFactor: null,
  source: '',
  note: '',
});

// a heavy wall with the insulation on the inside: the case a person reorders first
const doc = (): WorkbenchDocument => ({
  version: 2,
  layers: [
    layer('brick', 'Clay brick', 0.215, 0.77, 1700, 800, 'masonry'),
    layer('wool', 'Mineral wool', 0.1, 0.036, 100, 1030, 'insulation'),
    layer('plaster', 'Plaster', 0.013, 0.57, 1300, 1000, 'render'),
  ],
  exposure: defaultExposure(),
});

const pir: LibraryMaterial = {
  id: 7,
  teamId: null,
  builtinKey: 'pir-32',
  name: 'PIR board',
  materialClass: 'insulation',
  conductivity: 0.022,
  density: 32,
  specificHeat: 1400,
  vapourResistanceFactor: 60,
  source: 'a table',
  notes: '',
};

const s = () => useWorkbench.getState();
const names = () => s().doc.layers.map((l) => l.name);

beforeEach(() => {
  s().load({ assembly: null, base: null, doc: doc() });
});

describe('moveLayer', () => {
  it('moves a card to a new place and keeps the others in order', () => {
    s().moveLayer(1, 0);
    expect(names()).toEqual(['Mineral wool', 'Clay brick', 'Plaster']);
    s().moveLayer(0, 2);
    expect(names()).toEqual(['Clay brick', 'Plaster', 'Mineral wool']);
    expect(s().dirty).toBe(true);
  });

  it('ignores a move to the same place or out of range, and records no undo step for it', () => {
    s().moveLayer(1, 1);
    s().moveLayer(0, 9);
    expect(names()).toEqual(['Clay brick', 'Mineral wool', 'Plaster']);
    expect(s().past).toHaveLength(0);
    expect(s().dirty).toBe(false);
  });

  it('keeps the U-value and changes the time lag when the insulation goes outside', () => {
    // the steady resistance of series layers does not depend on their order (ISO 6946: the total resistance of homogeneous layers is the sum of their resistances)
    const before = selectFigures(s())!;
    s().moveLayer(1, 0);
    const after = selectFigures(s())!;
    expect(after.steady.uValue).toBeCloseTo(before.steady.uValue, 12);
    expect(after.periodic.timeLag).not.toBeCloseTo(before.periodic.timeLag, 0);
  });
});

describe('addLayer, duplicateLayer and removeLayer', () => {
  it('adds a library material at its typical thickness with a reference back to it', () => {
    const id = s().addLayer(pir, 1);
    const added = s().doc.layers[1];
    expect(added.id).toBe(id);
    expect(added).toMatchObject({ name: 'PIR board', materialRef: 'builtin:pir-32', conductivity: 0.022, vapourResistanceFactor: 60 });
    expect(added.thickness).toBeCloseTo(0.08, 12); // the built-in PIR board starts at 80 mm
  });

  it('duplicates a card right below itself with a new id', () => {
    const id = s().duplicateLayer('wool')!;
    expect(names()).toEqual(['Clay brick', 'Mineral wool', 'Mineral wool', 'Plaster']);
    expect(id).not.toBe('wool');
    expect(new Set(s().doc.layers.map((l) => l.id)).size).toBe(4);
  });

  it('removes a card and the text typed into its fields', () => {
    s().editField('wool', 'thickness', 'abc');
    s().removeLayer('wool');
    expect(names()).toEqual(['Clay brick', 'Plaster']);
    expect(s().drafts[draftKey('wool', 'thickness')]).toBeUndefined();
  });
});

describe('editField', () => {
  it('takes the thickness in mm and keeps it in m', () => {
    expect(s().editField('wool', 'thickness', '150')).toBeNull();
    expect(s().doc.layers[1].thickness).toBeCloseTo(0.15, 12);
  });

  it('names the problem and keeps the last valid model while the text is wrong', () => {
    const before = s().doc;
    expect(s().editField('wool', 'thickness', '0')).toBe('Thickness must be greater than 0 mm');
    expect(s().editField('wool', 'thickness', '-5')).toBe('Thickness must be greater than 0 mm');
    expect(s().editField('wool', 'thickness', '12 mm')).toBe('Thickness must be a number in mm');
    expect(s().editField('wool', 'conductivity', '')).toBe('Conductivity is required (in W/(m·K))');
    expect(s().editField('wool', 'density', '1e9')).toBe('Density must be at most 25,000 kg/m³');
    expect(s().editField('wool', 'name', '   ')).toBe('Name must not be empty');
    expect(s().doc).toBe(before);
    expect(s().drafts[draftKey('wool', 'thickness')]).toEqual({ raw: '12 mm', error: 'Thickness must be a number in mm' });
    expect(selectFigures(s())).not.toBeNull();
  });

  it('accepts a decimal comma', () => {
    s().editField('wool', 'conductivity', '0,034');
    expect(s().doc.layers[1].conductivity).toBe(0.034);
  });

  it('leaves the optional μ empty as null', () => {
    s().editField('wool', 'vapourResistanceFactor', '');
    expect(s().doc.layers[1].vapourResistanceFactor).toBeNull();
    expect(s().editField('wool', 'vapourResistanceFactor', '0.5')).toBe('Vapour resistance factor μ must be at least 1');
  });

  it('drops the library reference once a material property is changed, not for a thickness', () => {
    s().addLayer(pir, 0);
    const id = s().doc.layers[0].id;
    s().editField(id, 'thickness', '100');
    expect(s().doc.layers[0].materialRef).toBe('builtin:pir-32');
    s().editField(id, 'conductivity', '0.025');
    expect(s().doc.layers[0].materialRef).toBeNull();
  });

  it('joins the keystrokes of one field into one undo step, and starts a new one after endEdit', () => {
    s().editField('wool', 'thickness', '1');
    s().editField('wool', 'thickness', '12');
    s().editField('wool', 'thickness', '120');
    expect(s().past).toHaveLength(1);
    s().endEdit(draftKey('wool', 'thickness'));
    s().editField('wool', 'thickness', '140');
    expect(s().past).toHaveLength(2);
    s().undo();
    expect(s().doc.layers[1].thickness).toBeCloseTo(0.12, 12);
    s().undo();
    expect(s().doc.layers[1].thickness).toBeCloseTo(0.1, 12);
  });

  it('keeps a wrong draft and its message after the field loses focus', () => {
    s().editField('wool', 'thickness', 'x');
    s().endEdit(draftKey('wool', 'thickness'));
    expect(s().drafts[draftKey('wool', 'thickness')]?.error).toBe('Thickness must be a number in mm');
  });
});

describe('undo and redo', () => {
  it('walks back and forth through reorder, add, edit and remove', () => {
    const original = s().doc;
    s().moveLayer(1, 0);
    s().addLayer(pir);
    s().editField('brick', 'thickness', '102.5');
    s().removeLayer('plaster');
    expect(s().past).toHaveLength(4);
    for (let i = 0; i < 4; i++) s().undo();
    expect(s().doc).toBe(original);
    expect(s().dirty).toBe(false);
    s().redo();
    s().redo();
    expect(names()).toEqual(['Mineral wool', 'Clay brick', 'Plaster', 'PIR board']);
    s().undo();
    expect(names()).toEqual(['Mineral wool', 'Clay brick', 'Plaster']);
  });

  it('clears the redo steps when a new change is made', () => {
    s().moveLayer(1, 0);
    s().undo();
    expect(s().future).toHaveLength(1);
    s().moveLayer(2, 0);
    expect(s().future).toHaveLength(0);
    s().redo();
    expect(names()).toEqual(['Plaster', 'Clay brick', 'Mineral wool']);
  });

  it('undoes more than 50 steps, back to the opened document', () => {
    const original = s().doc;
    for (let i = 0; i < 60; i++) {
      s().moveLayer(i % 3, (i + 1) % 3);
      s().endEdit();
    }
    expect(s().past).toHaveLength(60);
    for (let i = 0; i < 60; i++) s().undo();
    expect(s().doc).toBe(original);
    for (let i = 0; i < 60; i++) s().redo();
    expect(s().past).toHaveLength(60);
  });

  it('keeps the newest steps when the history is longer than its limit', () => {
    for (let i = 0; i < HISTORY_LIMIT + 20; i++) {
      s().editField('wool', 'thickness', String(200 + i));
      s().endEdit(draftKey('wool', 'thickness'));
    }
    expect(s().past).toHaveLength(HISTORY_LIMIT);
  });

  it('drops the wrong text of fields when undoing', () => {
    s().moveLayer(1, 0);
    s().editField('wool', 'thickness', 'x');
    s().undo();
    expect(s().drafts).toEqual({});
  });

  it('undoes exposure changes too', () => {
    s().setExposure({ insideSurfaceResistance: 0.17 });
    s().setOutdoor({ mode: 'sine', mean: 18, amplitude: 5, peakHour: 14 });
    s().setIndoor({ mode: 'constant', value: 21 });
    expect(s().doc.exposure).toMatchObject({ insideSurfaceResistance: 0.17, outdoor: { mean: 18 }, indoor: { value: 21 } });
    s().undo();
    s().undo();
    s().undo();
    expect(s().doc.exposure).toEqual(defaultExposure());
  });
});

describe('markSaved', () => {
  it('makes the current document the saved one', () => {
    s().moveLayer(1, 0);
    s().markSaved({ id: 5, number: 2, state: 'draft', note: '', authorName: null, createdAt: '' });
    expect(s().dirty).toBe(false);
    expect(s().base?.number).toBe(2);
    s().undo();
    expect(s().dirty).toBe(true);
  });
});

describe('selectModel and selectFigures', () => {
  it('return the same object while the document is unchanged', () => {
    expect(selectModel(s())).toBe(selectModel(s()));
    expect(selectFigures(s())).toBe(selectFigures(s()));
    const m = selectModel(s());
    s().moveLayer(1, 0);
    expect(selectModel(s())).not.toBe(m);
  });

  it('give the engine model in metres with the layers in order', () => {
    const model = selectModel(s())!;
    expect(model.layers.map((l) => l.thickness)).toEqual([0.215, 0.1, 0.013]);
    expect(model.outside.surfaceResistance).toBe(0.04);
  });

  it('give no figures for an empty stack', () => {
    s().load({ assembly: null, base: null, doc: { ...doc(), layers: [] } });
    expect(selectFigures(s())).toBeNull();
    expect(selectModel(s())).toBeNull();
  });
});
