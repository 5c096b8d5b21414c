// the Moisture pane: the monthly climate and the ISO 13788 check of the build-up under it
import { useEffect, useMemo, useState } from 'react';
import { useWorkbench } from '../../../lib/workbench/store';
import { DEMO_CLIMATES, assessDocument, demoClimate, moistureIssues } from '../../../lib/moisture/index.ts';
import ClimateEditor from './ClimateEditor';
import MoistureResult, { MoistureCautions } from './MoistureResult';
import { layerFills } from './materialHex';

/** ms an edit must rest before the moisture check follows it */
const SETTLE_MS = 400;

/** the value once it has stopped changing for `ms` (the first value at once) */
function useSettled<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(settled, value)) return;
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, settled, ms]);
  return settled;
}

export default function MoisturePane({ readOnly = false }: { readOnly?: boolean }) {
  const liveLayers = useWorkbench((s) => s.doc.layers);
  const climate = useWorkbench((s) => s.doc.exposure.climate);
  // the check follows the build-up once edits pause, so a drag or a run of keystrokes never waits for it
  const layers = useSettled(liveLayers, SETTLE_MS);
  const checkedClimate = useSettled(climate, SETTLE_MS);
  const setExposure = useWorkbench((s) => s.setExposure);
  const [month, setMonth] = useState(1);
  const [editing, setEditing] = useState(false);
  const doc = useMemo(() => ({ layers, exposure: { climate: checkedClimate } }), [layers, checkedClimate]);
  const issues = useMemo(() => moistureIssues(doc), [doc]);
  const assessment = useMemo(() => (issues.length === 0 ? assessDocument(doc) : null), [doc, issues]);
  const fills = useMemo(() => layerFills(layers), [layers]);

  return (
    <section aria-labelledby="moisture-title" className="space-y-3" data-testid="moisture-pane">
      <div className="flex flex-wrap items-baseline gap-x-3">
        <h2 id="moisture-title" className="text-lg font-semibold">
          Moisture
        </h2>
        <p className="text-xs text-ink-soft">Interstitial condensation (Glaser, ISO 13788 monthly method) and the surface check for mould and condensation.</p>
        {climate ? (
          <button type="button" className="ml-auto rounded border border-line bg-panel px-3 py-1 text-sm hover:border-accent" aria-expanded={editing} onClick={() => setEditing((e) => !e)} data-testid="climate-toggle">
            {editing ? 'Hide the climate' : readOnly ? 'Show the climate' : 'Edit the climate'}
          </button>
        ) : null}
      </div>

      {!climate ? (
        <div className="rounded border border-dashed border-line-strong bg-panel px-4 py-5 text-sm" data-testid="moisture-empty">
          <p>No monthly climate yet. The moisture check needs twelve months of outdoor temperature and relative humidity and the indoor air.</p>
          {readOnly ? null : (
            <div className="mt-3 flex flex-wrap gap-2">
              {DEMO_CLIMATES.map((d) => (
                <button
                  key={d.key}
                  type="button"
                  title={d.description}
                  className="rounded border border-line bg-paper px-3 py-1 hover:border-accent"
                  onClick={() => {
                    setExposure({ climate: demoClimate(d.key) });
                    setEditing(true);
                  }}
                >
                  Start from {d.name}
                </button>
              ))}
            </div>
          )}
        </div>
      ) : null}

      {climate && editing ? <ClimateEditor climate={climate} readOnly={readOnly} /> : null}

      {climate && layers.length === 0 ? <p className="text-sm text-ink-soft">Add layers to the build-up to check them for moisture.</p> : null}
      {issues.length > 0 ? (
        <div role="alert" className="rounded border border-warn/40 bg-warn-soft px-3 py-2 text-sm" data-testid="moisture-issues">
          <p className="font-semibold">The moisture check needs the vapour resistance factor μ of every layer.</p>
          <ul className="list-disc pl-5">
            {layers.map((l, i) => (l.vapourResistanceFactor === null ? <li key={l.id}>Layer {i + 1}, {l.name}: give its μ in the build-up card.</li> : null))}
          </ul>
        </div>
      ) : null}
      {assessment ? <MoistureResult assessment={assessment} month={month} onMonth={setMonth} fills={fills} /> : climate ? <MoistureCautions /> : null}
    </section>
  );
}
