import { describe, expect, it } from 'vitest';
import { commonPeriod, compileSignal, signalAt, signalRate } from '../../../src/lib/thermal/signals.ts';

describe('signalAt', () => {
  it('returns the value of a constant signal at any time', () => {
    expect(signalAt(compileSignal({ kind: 'constant', value: 7.5 }), 12345)).toBe(7.5);
  });

  it('peaks a sine at its peak time and reaches mean minus amplitude half a period later', () => {
    // definition of the contract: mean + amplitude·cos(2π(t − peakTime)/period)
    const s = compileSignal({ kind: 'sine', mean: 20, amplitude: 8, period: 86400, peakTime: 54000 });
    expect(signalAt(s, 54000)).toBeCloseTo(28, 12);
    expect(signalAt(s, 54000 + 43200)).toBeCloseTo(12, 12);
    expect(signalAt(s, 54000 + 21600)).toBeCloseTo(20, 12);
  });

  it('interpolates a series linearly between samples and holds the last value without repeat', () => {
    const s = compileSignal({ kind: 'series', step: 3600, values: [0, 10, 4] });
    expect(signalAt(s, 0)).toBe(0);
    expect(signalAt(s, 1800)).toBeCloseTo(5, 12);
    expect(signalAt(s, 3600 + 900)).toBeCloseTo(8.5, 12);
    expect(signalAt(s, 7200)).toBe(4);
    expect(signalAt(s, 1e6)).toBe(4);
  });

  it('repeats a series with period values.length·step, ramping from the last value back to the first', () => {
    const s = compileSignal({ kind: 'series', step: 10, values: [0, 10, 20], repeat: true });
    expect(signalAt(s, 30)).toBeCloseTo(0, 12);
    expect(signalAt(s, 25)).toBeCloseTo(10, 12); // halfway from 20 back to 0
    expect(signalAt(s, 35)).toBeCloseTo(5, 12);
    expect(signalAt(s, 300 + 15)).toBeCloseTo(15, 12);
  });

  it('treats a single-value series as constant', () => {
    expect(signalAt(compileSignal({ kind: 'series', step: 60, values: [3] }), 1e5)).toBe(3);
  });
});

describe('signalRate', () => {
  it('gives the analytic derivative of a sine', () => {
    const s = compileSignal({ kind: 'sine', mean: 0, amplitude: 2, period: 100, peakTime: 0 });
    const w = (2 * Math.PI) / 100;
    expect(signalRate(s, 25, 0.01)).toBeCloseTo(-2 * w, 12);
  });

  it('gives the slope of a series between samples', () => {
    const s = compileSignal({ kind: 'series', step: 10, values: [0, 5] });
    expect(signalRate(s, 4, 0.01)).toBeCloseTo(0.5, 9);
  });
});

describe('repeat semantics (engine contract, Model: Signal)', () => {
  it('gives a 24-value hourly day a period of exactly 86400 s: values[0] holds again at t = 86400', () => {
    const values = Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 18 ? 21 : 17));
    const s = compileSignal({ kind: 'series', step: 3600, values, repeat: true });
    for (let t = 0; t < 3 * 86400; t += 1234) expect(signalAt(s, t + 86400)).toBeCloseTo(signalAt(s, t), 12);
    expect(signalAt(s, 86400)).toBe(values[0]);
    expect(signalAt(s, 86400 + 8 * 3600)).toBe(21);
    // after the last sample it runs linearly back to values[0]
    expect(signalAt(s, 23.5 * 3600)).toBeCloseTo(17, 12);
  });
});

describe('commonPeriod', () => {
  const base = { surfaceResistance: 0.04 };
  it('takes the longest period when the others divide it', () => {
    const r = commonPeriod({
      outside: { ...base, air: { kind: 'sine', mean: 0, amplitude: 1, period: 86400, peakTime: 0 } },
      inside: { surfaceResistance: 0.13, air: { kind: 'series', step: 3600, values: Array(168).fill(20), repeat: true } },
    });
    expect(r).toEqual({ ok: true, period: 7 * 86400 });
  });
  it('has no period when every signal is constant', () => {
    const r = commonPeriod({ outside: { ...base, air: { kind: 'constant', value: 0 } }, inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } } });
    expect(r).toEqual({ ok: true, period: null });
  });
  it('refuses a series without repeat and periods that do not divide', () => {
    expect(
      commonPeriod({ outside: { ...base, air: { kind: 'series', step: 60, values: [1, 2] } }, inside: { surfaceResistance: 0.13, air: { kind: 'constant', value: 20 } } }).ok,
    ).toBe(false);
    expect(
      commonPeriod({
        outside: { ...base, air: { kind: 'sine', mean: 0, amplitude: 1, period: 86400, peakTime: 0 } },
        inside: { surfaceResistance: 0.13, air: { kind: 'sine', mean: 0, amplitude: 1, period: 86400 * 0.7, peakTime: 0 } },
      }).ok,
    ).toBe(false);
  });
});
