// import of an hourly outdoor series: file → column mapping → validation with line numbers →
// preview chart → kept as an upload of the team
import { useEffect, useMemo, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { guessMapping, parseCsv, validateCsv, type CsvMapping, type ParsedCsv } from '../../lib/workbench/csv';
import type { UploadSummary } from '../../lib/schemas/upload';

const css = (name: string, fallback: string) =>
  typeof document === 'undefined' ? fallback : getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;

function Preview({ air, irradiance }: { air: number[]; irradiance?: number[] }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!box.current) return;
    const x = air.map((_, i) => i);
    const series: uPlot.Series[] = [{ label: 'hour' }, { label: 'Outdoor air (°C)', stroke: css('--color-t7', '#bf5038'), width: 1, scale: 'T' }];
    const data: uPlot.AlignedData = irradiance ? [x, air, irradiance] : [x, air];
    if (irradiance) series.push({ label: 'Irradiance (W/m²)', stroke: css('--color-warn', '#8a5a00'), width: 1, scale: 'I' });
    const u = new uPlot(
      {
        width: Math.max(280, box.current.clientWidth),
        height: 160,
        scales: { x: { time: false } },
        series,
        axes: [{ label: 'hour of the series' }, { scale: 'T', label: '°C' }, ...(irradiance ? [{ scale: 'I', side: 1, label: 'W/m²', grid: { show: false } }] : [])],
        legend: { show: true },
      },
      data,
      box.current,
    );
    return () => u.destroy();
  }, [air, irradiance]);
  return <div ref={box} className="w-full" data-testid="csv-preview-chart" />;
}

export default function CsvImport({ teamId, onClose, onSaved }: { teamId: number | null; onClose: () => void; onSaved: (u: UploadSummary) => void }) {
  const [fileName, setFileName] = useState('');
  const [name, setName] = useState('');
  const [nameTouched, setNameTouched] = useState(false);
  const [csv, setCsv] = useState<ParsedCsv | null>(null);
  const [mapping, setMapping] = useState<CsvMapping | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [saveError, setSaveError] = useState<string | null>(null);
  const [nameError, setNameError] = useState<string | null>(null);

  const result = useMemo(() => (csv && mapping ? validateCsv(csv, mapping) : null), [csv, mapping]);

  const readFile = async (file: File) => {
    setReadError(null);
    setSaveError(null);
    if (file.size > 20 * 1024 * 1024) {
      setReadError(`${file.name} is larger than 20 MB; ten years of hourly values fit well within that.`);
      return;
    }
    try {
      const text = await file.text();
      const parsed = parseCsv(text);
      if (parsed.rows.length === 0) {
        setReadError(`${file.name} holds no rows.`);
        return;
      }
      setCsv(parsed);
      setMapping(guessMapping(parsed));
      setFileName(file.name);
      if (!nameTouched) setName(file.name.replace(/\.[^.]+$/, ''));
    } catch (e) {
      setReadError(`${file.name} could not be read: ${e instanceof Error ? e.message : String(e)}`);
    }
  };

  const save = async () => {
    if (!result?.ok || !result.series || !mapping || !csv) return;
    const trimmed = name.trim();
    if (!trimmed) {
      setNameError('Name must not be empty');
      return;
    }
    setSaving(true);
    setSaveError(null);
    try {
      const res = await fetch('/api/uploads', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ ...(teamId ? { teamId } : {}), name: trimmed, fileName, mapping: { ...mapping, columns: csv.columns }, series: result.series }),
      });
      const body = await res.json().catch(() => null);
      if (res.status !== 201) {
        const fields = body?.error?.fields ? Object.entries(body.error.fields as Record<string, string>).map(([k, v]) => `${k}: ${v}`).join('; ') : '';
        setSaveError(`${body?.error?.message ?? `The upload was refused (HTTP ${res.status}).`}${fields ? ` ${fields}` : ''}`);
        return;
      }
      onSaved(body.upload as UploadSummary);
    } catch (e) {
      setSaveError(`The upload could not be sent: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setSaving(false);
    }
  };

  const columnSelect = (label: string, value: number | null, set: (v: number | null) => void, allowNone: string | null) => (
    <label className="flex flex-col gap-0.5">
      <span className="text-xs text-ink-soft">{label}</span>
      <select className="rounded border border-line px-2 py-1 bg-panel" value={value === null ? '' : String(value)} onChange={(e) => set(e.target.value === '' ? null : Number(e.target.value))} aria-label={label}>
        {allowNone !== null ? <option value="">{allowNone}</option> : null}
        {csv?.columns.map((c, i) => (
          <option key={i} value={i}>
            {c}
          </option>
        ))}
      </select>
    </label>
  );

  return (
    <div className="rounded border border-line-strong bg-panel p-3 flex flex-col gap-3" role="group" aria-label="Import a CSV file" data-testid="csv-import">
      <div className="flex items-center justify-between">
        <h3 className="font-semibold">Import an hourly series</h3>
        <button type="button" className="text-ink-soft hover:text-ink px-2" onClick={onClose} aria-label="Close the import">
          Close
        </button>
      </div>
      <p className="text-xs text-ink-soft">
        One row per hour, without gaps: a time column (for example 2025-07-14 15:00) or rows in order, an outdoor air temperature, and optionally the irradiance on the wall's face in W/m². At least a day, at most ten years.
      </p>
      <label className="flex flex-col gap-0.5">
        <span className="text-xs text-ink-soft">CSV file</span>
        <input type="file" accept=".csv,text/csv,text/plain" data-testid="csv-file" onChange={(e) => e.target.files?.[0] && void readFile(e.target.files[0])} />
      </label>
      {readError ? <p className="text-danger" role="alert">{readError}</p> : null}
      {csv && mapping ? (
        <>
          <div className="flex flex-wrap gap-3">
            {columnSelect('Time column', mapping.timeColumn, (v) => setMapping({ ...mapping, timeColumn: v }), 'None: rows are consecutive hours')}
            {columnSelect('Temperature column', mapping.temperatureColumn, (v) => setMapping({ ...mapping, temperatureColumn: v ?? 0 }), null)}
            <label className="flex flex-col gap-0.5">
              <span className="text-xs text-ink-soft">Temperature unit</span>
              <select className="rounded border border-line px-2 py-1 bg-panel" value={mapping.temperatureUnit} onChange={(e) => setMapping({ ...mapping, temperatureUnit: e.target.value as 'C' | 'F' })} aria-label="Temperature unit">
                <option value="C">°C</option>
                <option value="F">°F</option>
              </select>
            </label>
            {columnSelect('Irradiance column (W/m²)', mapping.irradianceColumn, (v) => setMapping({ ...mapping, irradianceColumn: v }), 'None')}
          </div>
          <div className="overflow-x-auto">
            <table className="text-xs tabular">
              <caption className="text-left text-ink-soft">
                First rows of {fileName} ({csv.rows.length.toLocaleString('en-GB')} rows{csv.hasHeader ? ', after the header' : ''})
              </caption>
              <thead>
                <tr>
                  <th className="px-2 text-left text-ink-faint">line</th>
                  {csv.columns.map((c, i) => (
                    <th key={i} className="px-2 text-left">
                      {c}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {csv.rows.slice(0, 5).map((r) => (
                  <tr key={r.line}>
                    <td className="px-2 text-ink-faint">{r.line}</td>
                    {csv.columns.map((_, i) => (
                      <td key={i} className="px-2">
                        {r.cells[i] ?? ''}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {result && !result.ok ? (
            <div role="alert" className="rounded border border-danger/40 bg-danger-soft p-2" data-testid="csv-problems">
              <p className="font-semibold">
                {result.problems.length + result.moreProblems} {result.problems.length + result.moreProblems === 1 ? 'problem' : 'problems'} in {fileName}; fix the file and choose it again.
              </p>
              <ul className="mt-1 text-xs list-none">
                {result.problems.map((p, i) => (
                  <li key={i}>
                    Line {p.line}: {p.message}
                  </li>
                ))}
              </ul>
              {result.moreProblems > 0 ? <p className="text-xs">…and {result.moreProblems} more.</p> : null}
            </div>
          ) : null}
          {result?.ok && result.series ? (
            <>
              <p className="text-xs text-ok" data-testid="csv-ok">
                {result.series.air.length.toLocaleString('en-GB')} hours read{result.firstTime ? `, ${result.firstTime} to ${result.lastTime}` : ''}
                {mapping.temperatureUnit === 'F' ? ', converted from °F to °C' : ''}.
              </p>
              <Preview air={result.series.air} irradiance={result.series.irradiance} />
              <div className="flex flex-wrap gap-3 items-end">
                <label className="flex flex-col gap-0.5">
                  <span className="text-xs text-ink-soft">Name of the upload</span>
                  <input
                    className={`rounded border px-2 py-1 w-72 ${nameError ? 'border-danger' : 'border-line'}`}
                    value={name}
                    maxLength={160}
                    aria-invalid={nameError ? true : undefined}
                    onChange={(e) => {
                      setName(e.target.value);
                      setNameTouched(true);
                      setNameError(e.target.value.trim() ? null : 'Name must not be empty');
                    }}
                  />
                  {nameError ? <span className="text-xs text-danger">{nameError}</span> : null}
                </label>
                <button type="button" className="px-3 py-1.5 rounded bg-accent text-white disabled:opacity-50" disabled={saving || !!nameError} onClick={() => void save()}>
                  {saving ? 'Keeping…' : 'Keep for the team'}
                </button>
              </div>
            </>
          ) : null}
          {saveError ? <p className="text-danger" role="alert">{saveError}</p> : null}
        </>
      ) : null}
    </div>
  );
}
