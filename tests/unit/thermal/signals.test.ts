import { describe, expect, it } from 'vitest';
import { compileSignal, jumpTimes, signalAt, signalRate } from '../../../src/lib/thermal/signals.ts';

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

describe('jumpTimes', () => {
  it('finds no jumps in smooth signals', () => {
    expect(jumpTimes({ kind: 'sine', mean: 0, amplitude: 30, period: 600, peakTime: 0 }, 1e5, 300)).toEqual([]);
    expect(jumpTimes({ kind: 'series', step: 3600, values: [0, 50, 0] }, 1e5, 300)).toEqual([]);
  });

  it('marks an unresolved change of a fine series as a jump at the start of its ramp', () => {
    expect(jumpTimes({ kind: 'series', step: 300, values: [0, 0, 10, 10] }, 1e5, 300)).toEqual([300]);
  });

  it('also marks the wrap-around of a repeating series', () => {
    const j = jumpTimes({ kind: 'series', step: 300, values: [0, 10], repeat: true }, 1200, 300);
    expect(j).toEqual([0, 300, 600]);
  });
});
