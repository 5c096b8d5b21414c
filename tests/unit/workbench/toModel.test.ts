import { describe, expect, it } from 'vitest';
import {
  defaultExposure,
  defaultPlaceSun,
  migrateDocument,
  toModel,
  workbenchDocumentSchema,
  type Exposure,
  type Outdoor,
  type WorkbenchDocument,
} from '../../../src/lib/schemas/workbench';
import { parseModel } from '../../../src/lib/schemas/model';
import { compileSignal, signalAt, modelSignals } from '../../../src/lib/thermal/index';

const DAY = 86400;

const layers: WorkbenchDocument['layers'] = [
  { id: 'a', name: 'Clay brick', materialRef: null, materialClass: 'masonry', thickness: 0.215, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: null, source: 'typical value, from memory', note: '' },
];
const doc = (exposure: Partial<Exposure>): WorkbenchDocument => ({ version: 2, layers, exposure: { ...defaultExposure(), ...exposure } });

const schedule = Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 18 ? 21 : 16) + h / 100);
const customSun: Outdoor = { mode: 'solair', mean: 20, amplitude: 5, peakHour: 15, absorptance: 0.6, face: { azimuth: 270, tilt: 90 }, sun: { source: 'custom', peakIrradiance: 550, sunrise: 11, sunset: 20 }, skyLoss: { emissivity: 0.9 } };
const placeSun: Outdoor = { mode: 'solair', mean: 20, amplitude: 5, peakHour: 15, absorptance: 0.6, face: { azimuth: 180, tilt: 30 }, sun: defaultPlaceSun(), skyLoss: { emissivity: 0.9 } };
const upload = { step: 3600, air: Array.from({ length: 72 }, (_, h) => 10 + 5 * Math.sin((2 * Math.PI * h) / 24) + h / 10) };

const modes: [string, WorkbenchDocument][] = [
  ['daily sine, constant indoor', doc({})],
  ['daily sine, 24-hour schedule', doc({ indoor: { mode: 'schedule', hourly: schedule } })],
  ['sol-air day with a custom sun and sky loss, schedule', doc({ outdoor: customSun, indoor: { mode: 'schedule', hourly: schedule } })],
  ['sol-air day by place and date', doc({ outdoor: placeSun })],
];

describe('toModel: true days', () => {
  for (const [name, d] of modes) {
    it(`repeats every signal with exactly 24 h and starts in the periodic state: ${name}`, () => {
      const model = toModel(d);
      const parsed = parseModel(model);
      expect(parsed.ok, JSON.stringify(!parsed.ok && parsed.issues)).toBe(true);
      expect(model.initial).toEqual({ kind: 'periodic' });
      // no warm-up: the run is the reported days alone
      expect(model.duration).toBe(d.exposure.days * DAY);
      for (const { path, signal } of modelSignals(parsed.ok ? parsed.model : (null as never))) {
        const s = compileSignal(signal);
        for (let t = 0; t < 5 * DAY; t += 1234.5) {
          expect(signalAt(s, t + DAY), `${path} at ${t} s`).toBeCloseTo(signalAt(s, t), 9);
        }
        if (signal.kind === 'series') expect(signal.values.length * signal.step, path).toBe(DAY);
      }
    });
  }

  it('builds the 24-hour schedule as 24 hourly values whose 08:00 value holds at 08:00 on every day', () => {
    const model = toModel(doc({ indoor: { mode: 'schedule', hourly: schedule } }));
    const air = model.inside.air;
    expect(air).toMatchObject({ kind: 'series', step: 3600, repeat: true });
    if (air.kind !== 'series') throw new Error('not a series');
    expect(air.values).toHaveLength(24);
    const s = compileSignal(air);
    for (let day = 0; day < 30; day++) {
      expect(signalAt(s, day * DAY + 8 * 3600)).toBe(schedule[8]);
      expect(signalAt(s, day * DAY)).toBe(schedule[0]);
      expect(signalAt(s, day * DAY + 23 * 3600)).toBe(schedule[23]);
    }
  });

  it('builds the clear-day sun as 144 values at 600 s, and the sky loss as a constant net loss', () => {
    const model = toModel(doc({ outdoor: customSun }));
    const irr = model.outside.solar!.irradiance;
    if (irr.kind !== 'series') throw new Error('not a series');
    expect(irr.step).toBe(600);
    expect(irr.values).toHaveLength(144);
    // the half sine peaks half-way between 11 h and 20 h
    const s = compileSignal(irr);
    expect(signalAt(s, 15.5 * 3600)).toBeCloseTo(550, 6);
    expect(signalAt(s, 3 * DAY + 15.5 * 3600)).toBeCloseTo(550, 6);
    // ISO 13790 §11.4.6: F_sky (wall) 0.5 × h_r 5·0.9 × 11 K = 24.75 W/m²
    expect(model.outside.longWave).toEqual({ netLoss: { kind: 'constant', value: 24.75 } });
  });

  it('runs an uploaded series from the steady state after its warm-up days, with the upload repeating by its own length', () => {
    const model = toModel(doc({ outdoor: { mode: 'series', uploadId: 3, absorptance: 0.6 }, days: 2, warmupDays: 5 }), upload);
    expect(model.initial).toEqual({ kind: 'steady' });
    expect(model.duration).toBe(7 * DAY);
    expect(model.outside.air).toEqual({ kind: 'series', step: 3600, values: upload.air, repeat: true });
    expect(parseModel(model).ok).toBe(true);
  });
});

describe('workbench documents: version 1 read as version 2', () => {
  const v1 = {
    version: 1,
    layers,
    exposure: {
      outdoor: { mode: 'solair', mean: 22, swing: 12, peakHour: 15, absorptance: 0.6, peakIrradiance: 550, sunrise: 11, sunset: 20 },
      indoor: { mode: 'constant', value: 24 },
      heatFlowDirection: 'horizontal',
      insideSurfaceResistance: 0.13,
      outsideSurfaceResistance: 0.04,
      days: 3,
      warmupDays: 4,
      timeStep: 300,
      maxCellSize: 0.005,
      indoorRelativeHumidity: 50,
    },
  };

  it('turns the swing (maximum − minimum) into the amplitude (half of it) and the hand-typed sun into a custom sun', () => {
    const parsed = workbenchDocumentSchema.safeParse(v1);
    expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
    const d = parsed.data!;
    expect(d.version).toBe(2);
    const out = d.exposure.outdoor;
    expect(out).toMatchObject({ mode: 'solair', amplitude: 6, face: { azimuth: 270, tilt: 90 }, sun: { source: 'custom', peakIrradiance: 550, sunrise: 11, sunset: 20 }, skyLoss: null });
    expect('swing' in out).toBe(false);
    // the same air sine as version 1 built: amplitude = swing / 2
    expect(toModel(d).outside.air).toEqual({ kind: 'sine', mean: 22, amplitude: 6, period: DAY, peakTime: 15 * 3600 });
    // its warm-up days are kept for a later upload but not run: a repeating day starts periodic
    expect(d.exposure.warmupDays).toBe(4);
    expect(toModel(d).duration).toBe(3 * DAY);
  });

  it('reads a version-1 daily sine and a document without a version the same way', () => {
    const sine = { ...v1, exposure: { ...v1.exposure, outdoor: { mode: 'sine', mean: 18, swing: 10, peakHour: 14 } } };
    const { version: _omit, ...noVersion } = sine;
    for (const input of [sine, noVersion]) {
      const d = workbenchDocumentSchema.parse(input);
      expect(d.exposure.outdoor).toEqual({ mode: 'sine', mean: 18, amplitude: 5, peakHour: 14 });
    }
  });

  it('leaves a version-2 document as it is, and names the field of a bad one', () => {
    const v2 = doc({ outdoor: placeSun });
    expect(migrateDocument(v2)).toBe(v2);
    const bad = structuredClone(v2) as unknown as { exposure: { outdoor: { sun: { latitude: number; date: string } } } };
    bad.exposure.outdoor.sun.latitude = 80;
    bad.exposure.outdoor.sun.date = '2026-02-30';
    const r = workbenchDocumentSchema.safeParse(bad);
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toContain('exposure.outdoor.sun.latitude');
    expect(paths).toContain('exposure.outdoor.sun.date');
  });
});
