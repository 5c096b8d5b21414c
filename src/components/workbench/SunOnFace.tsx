// the sun and sky of a sol-air day as read back to the engineer: the irradiance on the face over
// the day (a small line drawn from the 144 values the run uses), its peak and daily sum, and the
// long-wave loss to the sky with the sol-air drop it makes.
import { useMemo } from 'react';
import { skyLossOf, sunOnFace, type Outdoor } from '../../lib/schemas/workbench';
import { skyViewFactor, SKY_TEMPERATURE_DEPRESSION } from '../../lib/solar/longWave';
import Hint from './Hint';

const clock = (s: number) => `${String(Math.floor(s / 3600)).padStart(2, '0')}:${String(Math.round((s % 3600) / 60)).padStart(2, '0')}`;

export default function SunOnFace({ outdoor, outsideSurfaceResistance }: { outdoor: Extract<Outdoor, { mode: 'solair' }>; outsideSurfaceResistance: number }) {
  const values = useMemo(() => sunOnFace(outdoor), [outdoor]);
  let peak = 0;
  let at = 0;
  let sum = 0;
  values.forEach((v, i) => {
    if (v > peak) {
      peak = v;
      at = i * 600;
    }
    sum += v * 600;
  });
  const loss = skyLossOf(outdoor);
  const w = 288;
  const h = 56;
  const top = Math.max(peak, 100);
  const points = [...values, values[0]].map((v, i) => `${((i / values.length) * w).toFixed(1)},${(h - (v / top) * (h - 4)).toFixed(1)}`).join(' ');
  const sun = outdoor.sun;
  const how =
    sun.source === 'place'
      ? `Sun position from the suncalc package for the place and date; clear-sky beam by Hottel (1976) with the diffuse of Liu & Jordan (1960), climate "${sun.climate}", at ${sun.elevation} m; onto the face by the ${sun.transposition === 'isotropic' ? 'isotropic sky model of Liu & Jordan (1963)' : 'Hay & Davies (1980) sky model'} with ground reflectance ${sun.groundReflectance}. Every 10 minutes of the local clock (UTC${sun.timeZone >= 0 ? '+' : '−'}${Math.abs(sun.timeZone)} h): 144 values that repeat each day.`
      : 'Custom: a half sine between the two hours, zero outside them (common practice). 144 values at 10 minutes that repeat each day.';
  return (
    <div className="w-full flex flex-col gap-1 rounded border border-line bg-paper px-3 py-2 text-xs" data-testid="sun-on-face">
      <div className="flex flex-wrap gap-x-4 gap-y-1 items-baseline">
        <Hint text={how}>
          <span className="text-ink-soft">Irradiance on the face</span>
        </Hint>
        <span className="tabular" data-testid="irradiance-peak">
          peak <strong>{peak.toFixed(0)} W/m²</strong> at {clock(at)}
        </span>
        <span className="tabular" data-testid="irradiance-daily">
          day <strong>{(sum / 3.6e6).toFixed(2)} kWh/m²</strong>
        </span>
      </div>
      <svg viewBox={`0 0 ${w} ${h}`} width={w} height={h} role="img" aria-label={`Irradiance on the face over the day, peak ${peak.toFixed(0)} W/m² at ${clock(at)}`} className="max-w-full">
        <line x1="0" x2={w} y1={h - 0.5} y2={h - 0.5} className="stroke-line" />
        {[6, 12, 18].map((hh) => (
          <line key={hh} x1={(hh / 24) * w} x2={(hh / 24) * w} y1={0} y2={h} className="stroke-line" strokeDasharray="2 3" />
        ))}
        <polyline points={points} fill="none" className="stroke-accent" strokeWidth="1.5" />
      </svg>
      <div className="flex justify-between text-ink-faint tabular" aria-hidden="true" style={{ width: w, maxWidth: '100%' }}>
        <span>00</span>
        <span>06</span>
        <span>12</span>
        <span>18</span>
        <span>24 h</span>
      </div>
      <div data-testid="sky-loss">
        {loss === null ? (
          <span className="text-ink-soft">No long-wave loss to the sky.</span>
        ) : (
          <Hint
            text={`ISO 13790:2008 §11.4.6 (as in ISO 52016-1): q = F_sky · h_r · Δθ_er with h_r = 5·ε W/m²K, Δθ_er = ${SKY_TEMPERATURE_DEPRESSION} K between the air and the apparent sky, and F_sky = (1 + cos β)/2 = ${skyViewFactor(outdoor.face.tilt).toFixed(2)} for a tilt of ${outdoor.face.tilt}°. Constant over the day; it lowers the sol-air temperature by R_se · q.`}
          >
            <span>
              Long-wave loss to the sky <strong className="tabular">{loss.toFixed(1)} W/m²</strong>, lowering the sol-air temperature by{' '}
              <strong className="tabular">{(loss * outsideSurfaceResistance).toFixed(2)} K</strong>
            </span>
          </Hint>
        )}
      </div>
    </div>
  );
}
