// monthly heat through the inside surface of a long run: gained (into the room) and lost, kWh/m²,
// as paired bars; a plain SVG, read with the numbers in its title and a table for screen readers.
import type { MonthHeat } from '../../lib/workbench/figures';
import Hint from './Hint';

export default function MonthlyBars({ months }: { months: MonthHeat[] }) {
  const top = Math.max(1e-6, ...months.map((m) => Math.max(m.gained, m.lost)));
  const bw = 9;
  const gap = 6;
  const h = 90;
  const w = months.length * (2 * bw + gap) + gap;
  return (
    <figure className="flex flex-col gap-1 text-xs" data-testid="monthly-bars">
      <figcaption>
        <Hint text="Time integrals of the positive (into the room) and negative (out of the room) parts of the inside heat flux in each month of the reported period. Uploads carry no dates: months are counted from the first reported day with the lengths of a common year from January.">
          <span className="text-ink-soft">Heat through the inside surface by month (kWh/m²)</span>
        </Hint>
        <span className="ml-3 inline-flex items-center gap-1">
          <span className="inline-block w-2.5 h-2.5 bg-[var(--color-t7)]" /> gained
        </span>
        <span className="ml-2 inline-flex items-center gap-1">
          <span className="inline-block w-2.5 h-2.5 bg-[var(--color-t1)]" /> lost
        </span>
      </figcaption>
      <svg viewBox={`0 0 ${w} ${h + 14}`} width={Math.min(w * 1.6, 640)} role="img" aria-label="Monthly heat gained and lost through the inside surface">
        {months.map((m, i) => {
          const x = gap + i * (2 * bw + gap);
          const hg = (m.gained / top) * h;
          const hl = (m.lost / top) * h;
          return (
            <g key={m.month}>
              <rect x={x} y={h - hg} width={bw} height={hg} fill="var(--color-t7)">
                <title>{`Month ${m.month}: ${m.gained.toFixed(2)} kWh/m² gained`}</title>
              </rect>
              <rect x={x + bw} y={h - hl} width={bw} height={hl} fill="var(--color-t1)">
                <title>{`Month ${m.month}: ${m.lost.toFixed(2)} kWh/m² lost`}</title>
              </rect>
              <text x={x + bw} y={h + 11} textAnchor="middle" fontSize="8" className="fill-ink-soft">
                {m.month}
              </text>
            </g>
          );
        })}
      </svg>
      <table className="sr-only">
        <thead>
          <tr>
            <th>Month</th>
            <th>Gained, kWh/m²</th>
            <th>Lost, kWh/m²</th>
          </tr>
        </thead>
        <tbody>
          {months.map((m) => (
            <tr key={m.month}>
              <td>{m.month}</td>
              <td>{m.gained.toFixed(3)}</td>
              <td>{m.lost.toFixed(3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}
