import { useId, useState } from 'react';
import type { LibraryMaterial } from '../../lib/materials/library';
import { FIELD_LABELS, materialFieldsSchema, type MaterialFields } from '../../lib/materials/schema';
import { CLASS_LABELS } from '../../lib/materials/builtin';
import { MATERIAL_CLASSES } from '../../lib/schemas/workbench';
import Modal from '../workbench/Modal';

type Key = keyof MaterialFields;
const NUMERIC: { key: Key; unit: string }[] = [
  { key: 'conductivity', unit: 'W/(m·K)' },
  { key: 'density', unit: 'kg/m³' },
  { key: 'specificHeat', unit: 'J/(kg·K)' },
  { key: 'vapourResistanceFactor', unit: '–' },
];

const text = (v: number | undefined) => (v === undefined ? '' : String(v));

/** create or edit one team material; every field is checked before sending and the server's messages land on their fields */
export default function MaterialForm({ teamId, material, onClose, onSaved }: { teamId: number; material: LibraryMaterial | null; onClose(): void; onSaved(m: LibraryMaterial, created: boolean): void }) {
  const [values, setValues] = useState<Record<Key, string>>({
    name: material?.name ?? '',
    materialClass: material?.materialClass ?? 'insulation',
    conductivity: text(material?.conductivity),
    density: text(material?.density),
    specificHeat: text(material?.specificHeat),
    vapourResistanceFactor: text(material?.vapourResistanceFactor ?? 1),
    source: material?.source ?? '',
    notes: material?.notes ?? '',
  });
  const [errors, setErrors] = useState<Partial<Record<Key, string>>>({});
  const [formError, setFormError] = useState('');
  const [busy, setBusy] = useState(false);
  const id = useId();

  const set = (k: Key, v: string) => {
    setValues((s) => ({ ...s, [k]: v }));
    if (errors[k]) setErrors((e) => ({ ...e, [k]: undefined }));
  };

  const submit = async () => {
    const num = (s: string) => (s.trim() === '' ? undefined : /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s.trim().replace(',', '.')) ? Number(s.trim().replace(',', '.')) : s);
    const candidate = {
      ...values,
      conductivity: num(values.conductivity),
      density: num(values.density),
      specificHeat: num(values.specificHeat),
      vapourResistanceFactor: num(values.vapourResistanceFactor),
    };
    const parsed = materialFieldsSchema.safeParse(candidate);
    if (!parsed.success) {
      const e: Partial<Record<Key, string>> = {};
      for (const issue of parsed.error.issues) {
        const k = issue.path[0] as Key;
        if (!e[k]) e[k] = `${FIELD_LABELS[k]} ${issue.message}`;
      }
      setErrors(e);
      setFormError('Some fields need attention.');
      return;
    }
    setBusy(true);
    setFormError('');
    try {
      const r = await fetch(material ? `/api/materials/${material.id}` : '/api/materials', {
        method: material ? 'PATCH' : 'POST',
        headers: { 'content-type': 'application/json', accept: 'application/json' },
        body: JSON.stringify(material ? parsed.data : { ...parsed.data, teamId }),
      });
      const body = (await r.json().catch(() => null)) as { material?: LibraryMaterial; error?: { message: string; fields?: Record<string, string> } } | null;
      if (r.ok && body?.material) {
        onSaved(body.material, !material);
        return;
      }
      const e: Partial<Record<Key, string>> = {};
      for (const [k, v] of Object.entries(body?.error?.fields ?? {})) e[k as Key] = `${FIELD_LABELS[k as Key] ?? k} ${v}`;
      setErrors(e);
      setFormError(body?.error?.message ?? `Saving failed (HTTP ${r.status}).`);
    } catch {
      setFormError('The server could not be reached; nothing was saved. Try again.');
    } finally {
      setBusy(false);
    }
  };

  const field = (k: Key, label: string, input: React.ReactNode) => (
    <div>
      <label htmlFor={`${id}-${k}`} className="block text-sm font-semibold">
        {label}
      </label>
      {input}
      {errors[k] ? (
        <p id={`${id}-${k}-err`} className="mt-0.5 text-xs font-semibold text-danger">
          {errors[k]}
        </p>
      ) : null}
    </div>
  );
  const inputProps = (k: Key) => ({
    id: `${id}-${k}`,
    value: values[k],
    onChange: (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement>) => set(k, e.target.value),
    'aria-invalid': errors[k] ? true : undefined,
    'aria-describedby': errors[k] ? `${id}-${k}-err` : undefined,
    className: `mt-0.5 w-full rounded border px-2 py-1.5 text-sm ${errors[k] ? 'border-danger bg-danger-soft' : 'border-line'}`,
  });

  return (
    <Modal title={material ? `Edit “${material.name}”` : 'New team material'} onClose={onClose} testId="material-form">
      <form
        noValidate
        className="mt-3 space-y-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (!busy) submit();
        }}
      >
        {field('name', 'Name', <input {...inputProps('name')} type="text" autoComplete="off" />)}
        {field(
          'materialClass',
          'Class',
          <select {...inputProps('materialClass')}>
            {MATERIAL_CLASSES.map((c) => (
              <option key={c} value={c}>
                {CLASS_LABELS[c]}
              </option>
            ))}
          </select>,
        )}
        <div className="grid grid-cols-2 gap-3">
          {NUMERIC.map(({ key, unit }) => field(key, `${FIELD_LABELS[key]} [${unit}]`, <input {...inputProps(key)} type="text" inputMode="decimal" className={`${inputProps(key).className} text-right tabular`} />))}
        </div>
        {field('source', 'Source of the values', <input {...inputProps('source')} type="text" placeholder="e.g. manufacturer’s declaration of performance, 2025" />)}
        {field('notes', 'Notes', <textarea {...inputProps('notes')} rows={2} />)}
        {formError ? (
          <p role="alert" className="rounded bg-danger-soft px-2 py-1.5 text-sm text-danger">
            {formError}
          </p>
        ) : null}
        <div className="flex justify-end gap-2">
          <button type="button" onClick={onClose} className="rounded border border-line px-3 py-1.5 text-sm">
            Cancel
          </button>
          <button type="submit" disabled={busy} className="rounded bg-accent px-4 py-1.5 text-sm font-semibold text-white disabled:opacity-50">
            {busy ? 'Saving…' : material ? 'Save changes' : 'Add to the library'}
          </button>
        </div>
      </form>
    </Modal>
  );
}
