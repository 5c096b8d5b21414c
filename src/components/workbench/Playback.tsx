// playback of one run: the profile through the thickness on a canvas, the traces (uPlot)
// and the controls; PNG export of each chart.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import './traces.css';
import type { RunDone } from '../../lib/workbench/runner';
import type { MaterialClass } from '../../lib/schemas/workbench';
import { dayClock } from '../../lib/workbench/figures';
import { download, withTitle } from './chartExport';
import { drawProfile, profileRange, profileStyle, type ProfileStyle } from './profileDraw';

/** "a day in N s" */
const SPEEDS = [60, 30, 20, 10, 5, 2];

const css = (name: string, fallback: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

/** the width of a box's content, px: its client width less its left and right padding */
function contentWidth(el: HTMLElement): number {
  const cs = getComputedStyle(el);
  return Math.floor(el.clientWidth - parseFloat(cs.paddingLeft || '0') - parseFloat(cs.paddingRight || '0'));
}

/** playback of one run: the profile canvas, the traces, the controls */
export default function Playback({ run, classes }: { run: RunDone; classes: MaterialClass[] }) {
  const profileBox = useRef<HTMLDivElement>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const tempBox = useRef<HTMLDivElement>(null);
  const fluxBox = useRef<HTMLDivElement>(null);
  const scrub = useRef<HTMLInputElement>(null);
  const timeOut = useRef<HTMLSpanElement>(null);
  const surfOut = useRef<HTMLSpanElement>(null);
  const fluxOut = useRef<HTMLSpanElement>(null);
  const tempPlot = useRef<uPlot | null>(null);
  const fluxPlot = useRef<uPlot | null>(null);
  const pos = useRef(0);
  const speed = useRef(10);
  const [playing, setPlaying] = useState(false);
  const [speedShown, setSpeedShown] = useState(10);
  const style = useRef<ProfileStyle | null>(null);
  const scratch = useRef(new Float64Array(0));
  const size = useRef({ w: 600, h: 260 });
  const range = useMemo(() => profileRange(run), [run]);
  const hours = useMemo(() => Float64Array.from(run.series.time, (t) => t / 3600), [run]);
  const shape = `${run.nInterfaces}|${run.interfaceNames.join('|')}`;

  const draw = useCallback(() => {
    const c = canvas.current;
    if (!c) return;
    const ctx = c.getContext('2d');
    if (!ctx) return;
    style.current ??= profileStyle();
    if (scratch.current.length !== run.nNodes) scratch.current = new Float64Array(run.nNodes);
    const dpr = window.devicePixelRatio || 1;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    drawProfile(ctx, size.current.w, size.current.h, run, classes, range, pos.current, style.current, scratch.current);
    const k = Math.round(pos.current);
    const t = run.series.time[k];
    if (timeOut.current) timeOut.current.textContent = dayClock(t);
    if (surfOut.current) surfOut.current.textContent = run.series.insideSurface[k].toFixed(2);
    if (fluxOut.current) fluxOut.current.textContent = run.series.insideFlux[k].toFixed(2);
    if (scrub.current && document.activeElement !== scrub.current) scrub.current.value = String(k);
    if (scrub.current) scrub.current.setAttribute('aria-valuetext', dayClock(t));
    for (const u of [tempPlot.current, fluxPlot.current]) {
      if (!u) continue;
      // outputs are uniform, so the fractional index maps straight to hours
      u.setCursor({ left: u.valToPos((pos.current * run.outputInterval) / 3600, 'x'), top: 8 }, false);
    }
  }, [run, classes, range, hours]);

  // canvas size follows its box (the width inside its padding, so the canvas never spills over the border)
  useEffect(() => {
    const box = profileBox.current;
    const c = canvas.current;
    if (!box || !c) return;
    const fit = () => {
      const w = Math.max(320, contentWidth(box));
      const h = 280;
      const dpr = window.devicePixelRatio || 1;
      size.current = { w, h };
      c.width = w * dpr;
      c.height = h * dpr;
      c.style.width = `${w}px`;
      c.style.height = `${h}px`;
      tempPlot.current?.setSize({ width: w, height: 220 });
      fluxPlot.current?.setSize({ width: w, height: 150 });
      draw();
    };
    fit();
    const ro = new ResizeObserver(fit);
    ro.observe(box);
    return () => ro.disconnect();
  }, [draw]);

  // the traces: made once per shape of the result, then fed with setData
  useEffect(() => {
    if (!tempBox.current || !fluxBox.current) return;
    const w = Math.max(320, profileBox.current ? contentWidth(profileBox.current) : 600);
    const faint = css('--color-ink-faint', '#8b857a');
    const axis = { stroke: css('--color-ink-soft', '#5d5850'), grid: { stroke: css('--color-line', '#dedad2'), width: 1 }, ticks: { stroke: css('--color-line', '#dedad2') } };
    const hourAxis = { ...axis, label: 'hours from the start of day 1', values: (_u: uPlot, v: number[]) => v.map((x) => `${x}`) };
    const series: uPlot.Series[] = [
      { label: 'time', value: (_u, v) => (v === null ? '–' : dayClock(v * 3600)) },
      { label: 'outdoor air', stroke: css('--color-t1', '#3f6ea8'), width: 1.5, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      { label: 'sol-air', stroke: css('--color-warn', '#8a5a00'), width: 1, dash: [5, 4], value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      { label: 'outside surface', stroke: css('--color-t2', '#79a0c8'), width: 1.5, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      ...run.interfaceNames.map((n) => ({ label: n, stroke: faint, width: 1, dash: [2, 3], value: (_u: uPlot, v: number | null) => (v === null ? '–' : `${v.toFixed(2)} °C`) })),
      { label: 'inside surface', stroke: css('--color-t7', '#bf5038'), width: 2, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
      { label: 'indoor air', stroke: css('--color-accent', '#21646a'), width: 1.5, value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} °C`) },
    ];
    const temp = new uPlot(
      {
        width: w,
        height: 220,
        scales: { x: { time: false } },
        series,
        axes: [hourAxis, { ...axis, label: '°C' }],
        cursor: { drag: { x: false, y: false }, points: { show: false } },
        legend: { live: true },
      },
      [[], ...series.slice(1).map(() => [])] as unknown as uPlot.AlignedData,
      tempBox.current,
    );
    const flux = new uPlot(
      {
        width: w,
        height: 150,
        scales: { x: { time: false } },
        series: [
          { label: 'time', value: (_u, v) => (v === null ? '–' : dayClock(v * 3600)) },
          { label: 'inside heat flux (+ into the room)', stroke: css('--color-accent-strong', '#174a4f'), width: 2, fill: 'rgba(33,100,106,0.08)', value: (_u, v) => (v === null ? '–' : `${v.toFixed(2)} W/m²`) },
        ],
        axes: [hourAxis, { ...axis, label: 'W/m²' }],
        cursor: { drag: { x: false, y: false }, points: { show: false } },
      },
      [[], []],
      fluxBox.current,
    );
    tempPlot.current = temp;
    fluxPlot.current = flux;
    return () => {
      temp.destroy();
      flux.destroy();
      tempPlot.current = null;
      fluxPlot.current = null;
    };
  }, [shape]);

  // new data into the same charts
  useEffect(() => {
    const s = run.series;
    const interfaces = Array.from({ length: run.nInterfaces }, (_, j) => s.interfaces.subarray(j * run.nTimes, (j + 1) * run.nTimes));
    tempPlot.current?.setData([hours, s.outsideAir, s.solAir, s.outsideSurface, ...interfaces, s.insideSurface, s.insideAir] as unknown as uPlot.AlignedData);
    fluxPlot.current?.setData([hours, s.insideFlux] as unknown as uPlot.AlignedData);
    pos.current = Math.min(pos.current, run.nTimes - 1);
    draw();
  }, [run, hours, shape, draw]);

  // playback: advance by wall-clock time, a day in `speed` seconds
  useEffect(() => {
    if (!playing) return;
    let last = performance.now();
    let frame = requestAnimationFrame(function tick(now) {
      const dt = (now - last) / 1000;
      last = now;
      pos.current += (dt * 86400) / speed.current / run.outputInterval;
      if (pos.current >= run.nTimes - 1) pos.current = 0;
      draw();
      frame = requestAnimationFrame(tick);
    });
    return () => cancelAnimationFrame(frame);
  }, [playing, run, draw]);

  const pngOf = (which: 'profile' | 'temperatures' | 'flux') => {
    if (which === 'profile' && canvas.current) download('profile.png', withTitle(canvas.current, `Temperature through the wall, ${dayClock(run.series.time[Math.round(pos.current)])}`));
    const u = which === 'temperatures' ? tempPlot.current : which === 'flux' ? fluxPlot.current : null;
    if (u) download(`${which}.png`, withTitle(u.ctx.canvas, which === 'temperatures' ? 'Temperatures (°C) over the reported days' : 'Inside heat flux (W/m², positive into the room)'));
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="rounded border border-line bg-panel p-2" ref={profileBox}>
        <canvas ref={canvas} role="img" aria-label="Temperature profile through the thickness at the playback time" data-testid="profile-canvas" />
        <div className="flex flex-wrap items-center gap-3 mt-2">
          <button
            type="button"
            className="px-3 py-1 rounded border border-line-strong bg-panel hover:bg-paper w-20"
            onClick={() => setPlaying((p) => !p)}
            aria-pressed={playing}
            data-testid="play"
          >
            {playing ? 'Pause' : 'Play'}
          </button>
          <label className="flex items-center gap-2 grow min-w-48">
            <span className="sr-only">Playback time</span>
            <input
              ref={scrub}
              type="range"
              min={0}
              max={run.nTimes - 1}
              step={1}
              defaultValue={0}
              className="grow accent-accent"
              aria-label="Playback time"
              data-testid="scrub"
              onInput={(e) => {
                pos.current = Number((e.target as HTMLInputElement).value);
                draw();
              }}
            />
          </label>
          <span className="tabular font-semibold w-28" ref={timeOut} data-testid="playback-time" aria-live="off" />
          <label className="flex items-center gap-1">
            <span className="text-ink-soft">Speed</span>
            <select
              className="rounded border border-line px-1.5 py-1 bg-panel"
              value={speedShown}
              onChange={(e) => {
                speed.current = Number(e.target.value);
                setSpeedShown(speed.current);
              }}
            >
              {SPEEDS.map((s) => (
                <option key={s} value={s}>
                  a day in {s} s
                </option>
              ))}
            </select>
          </label>
        </div>
        <p className="mt-1 text-xs text-ink-soft tabular">
          Inside surface <span ref={surfOut} data-testid="readout-inside-surface" className="text-ink font-semibold" /> °C · inside heat flux <span ref={fluxOut} className="text-ink font-semibold" /> W/m²
        </p>
      </div>
      <div className="wp-traces rounded border border-line bg-panel p-2" data-testid="trace-temperatures">
        <div ref={tempBox} />
      </div>
      <div className="wp-traces rounded border border-line bg-panel p-2" data-testid="trace-flux">
        <div ref={fluxBox} />
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => pngOf('profile')}>
          Profile as PNG
        </button>
        <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => pngOf('temperatures')}>
          Temperatures as PNG
        </button>
        <button type="button" className="px-2.5 py-1 rounded border border-line bg-panel hover:bg-paper" onClick={() => pngOf('flux')}>
          Heat flux as PNG
        </button>
      </div>
    </div>
  );
}
