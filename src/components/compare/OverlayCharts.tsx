// the compared alternatives' inside surface temperature and inside heat flux, overlaid (uPlot):
// the charts are made once per set of alternatives and fed new data with setData
import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import '../workbench/traces.css';
import { dayClock } from '../../lib/workbench/figures';
import type { CompareSeries } from '../../lib/workbench/compare';
import { ALTERNATIVE_STYLE, alternativeColour } from './palette';

const css = (name: string, fallback: string) => getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

export interface OverlayProps {
  labels: string[];
  series: CompareSeries[];
}

function widthOf(el: HTMLElement | null): number {
  if (!el) return 600;
  const cs = getComputedStyle(el);
  return Math.max(300, Math.floor(el.clientWidth - parseFloat(cs.paddingLeft || '0') - parseFloat(cs.paddingRight || '0')));
}

export default function OverlayCharts({ labels, series }: OverlayProps) {
  const box = useRef<HTMLDivElement>(null);
  const tempBox = useRef<HTMLDivElement>(null);
  const fluxBox = useRef<HTMLDivElement>(null);
  const plots = useRef<{ temp: uPlot; flux: uPlot } | null>(null);
  const shape = labels.join('\u0000');

  useEffect(() => {
    if (!tempBox.current || !fluxBox.current) return;
    const w = widthOf(box.current);
    const axis = { stroke: css('--color-ink-soft', '#5d5850'), grid: { stroke: css('--color-line', '#dedad2'), width: 1 }, ticks: { stroke: css('--color-line', '#dedad2') } };
    const hourAxis = { ...axis, label: 'hours from the start of the first reported day' };
    const time: uPlot.Series = { label: 'time', value: (_u, v) => (v === null ? '–' : dayClock(v * 3600)) };
    const lines = (unit: string): uPlot.Series[] =>
      labels.map((label, i) => ({
        label,
        stroke: alternativeColour(i),
        width: 2,
        dash: [...ALTERNATIVE_STYLE[i % ALTERNATIVE_STYLE.length].dash],
        value: (_u: uPlot, v: number | null) => (v === null ? '–' : `${v.toFixed(2)} ${unit}`),
      }));
    const opts = (height: number, unit: string, s: uPlot.Series[]): uPlot.Options => ({
      width: w,
      height,
      scales: { x: { time: false } },
      series: [time, ...s],
      axes: [hourAxis, { ...axis, label: unit }],
      cursor: { drag: { x: false, y: false }, points: { show: true }, sync: { key: 'wallpulse-compare' } },
      legend: { live: true },
    });
    const empty = [[], ...labels.map(() => [])] as unknown as uPlot.AlignedData;
    const temp = new uPlot(opts(240, '°C', lines('°C')), empty, tempBox.current);
    const flux = new uPlot(opts(200, 'W/m²', lines('W/m²')), empty, fluxBox.current);
    plots.current = { temp, flux };
    const ro = new ResizeObserver(() => {
      const width = widthOf(box.current);
      temp.setSize({ width, height: 240 });
      flux.setSize({ width, height: 200 });
    });
    if (box.current) ro.observe(box.current);
    return () => {
      ro.disconnect();
      temp.destroy();
      flux.destroy();
      plots.current = null;
    };
  }, [shape]);

  useEffect(() => {
    const p = plots.current;
    if (!p || series.length === 0) return;
    // the alternatives share one exposure, so one output clock; a shorter series is padded with gaps
    const x = series.reduce((a, s) => (s.hours.length > a.length ? s.hours : a), series[0].hours);
    const pad = (a: Float64Array) => (a.length === x.length ? a : Float64Array.from(x, (_, k) => (k < a.length ? a[k] : NaN)));
    p.temp.setData([x, ...series.map((s) => pad(s.insideSurface))] as unknown as uPlot.AlignedData);
    p.flux.setData([x, ...series.map((s) => pad(s.insideFlux))] as unknown as uPlot.AlignedData);
  }, [series, shape]);

  return (
    <div ref={box} className="flex flex-col gap-3" data-testid="compare-charts">
      <figure className="wp-traces rounded border border-line bg-panel p-2 break-inside-avoid" data-testid="compare-trace-surface">
        <figcaption className="px-1 text-sm font-semibold">Inside surface temperature</figcaption>
        <div ref={tempBox} />
      </figure>
      <figure className="wp-traces rounded border border-line bg-panel p-2 break-inside-avoid" data-testid="compare-trace-flux">
        <figcaption className="px-1 text-sm font-semibold">Inside heat flux <span className="font-normal text-ink-soft">(positive into the room)</span></figcaption>
        <div ref={fluxBox} />
      </figure>
    </div>
  );
}
