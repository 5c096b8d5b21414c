import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { fetchMaterials, type LibraryMaterial } from '../../lib/materials/library';
import { CLASS_LABELS } from '../../lib/materials/builtin';
import { MATERIAL_CLASSES } from '../../lib/schemas/workbench';
import { MAT_BG } from './materialStyle';
import { fixed } from './format';

const cache = new Map<number, Promise<LibraryMaterial[]>>();

/** the built-ins and the team's own, fetched once per page */
export function loadMaterials(teamId: number): Promise<LibraryMaterial[]> {
  let p = cache.get(teamId);
  if (!p) {
    p = fetchMaterials(teamId).catch((err: unknown) => {
      cache.delete(teamId);
      throw err;
    });
    cache.set(teamId, p);
  }
  return p;
}

export interface PickerPlace {
  value: string;
  label: string;
  /** index to insert at */
  index: number;
}

interface Props {
  teamId: number;
  places: PickerPlace[];
  onPick(material: LibraryMaterial, index: number): void;
  onClose(): void;
}

/** a modal list of the library, searchable, grouped by material class, usable from the keyboard alone */
export default function MaterialPicker({ teamId, places, onPick, onClose }: Props) {
  const [materials, setMaterials] = useState<LibraryMaterial[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [query, setQuery] = useState('');
  const [active, setActive] = useState(0);
  const [place, setPlace] = useState(places[places.length - 1]?.value ?? 'end');
  const search = useRef<HTMLInputElement>(null);
  const listRef = useRef<HTMLUListElement>(null);
  const dialog = useRef<HTMLDivElement>(null);
  const opener = useRef<Element | null>(null);
  const listId = useId();
  const titleId = useId();

  useEffect(() => {
    opener.current = document.activeElement;
    search.current?.focus();
    let live = true;
    loadMaterials(teamId).then(
      (m) => live && setMaterials(m),
      (e: Error) => live && setError(e.message),
    );
    return () => {
      live = false;
      (opener.current as HTMLElement | null)?.focus?.();
    };
  }, [teamId]);

  const groups = useMemo(() => {
    if (!materials) return [];
    const words = query.toLowerCase().split(/\s+/).filter(Boolean);
    const hits = materials.filter((m) => {
      const text = `${m.name} ${CLASS_LABELS[m.materialClass]} ${m.teamId ? 'team' : 'built-in'}`.toLowerCase();
      return words.every((w) => text.includes(w));
    });
    return MATERIAL_CLASSES.map((cls) => ({ cls, items: hits.filter((m) => m.materialClass === cls) })).filter((g) => g.items.length > 0);
  }, [materials, query]);
  const flat = useMemo(() => groups.flatMap((g) => g.items), [groups]);

  useEffect(() => setActive(0), [query]);
  useEffect(() => {
    listRef.current?.querySelector(`[data-index="${active}"]`)?.scrollIntoView({ block: 'nearest' });
  }, [active]);

  const pick = (m: LibraryMaterial) => {
    const at = places.find((p) => p.value === place)?.index ?? Number.MAX_SAFE_INTEGER;
    onPick(m, at);
  };

  const onKeyDown = (e: React.KeyboardEvent) => {
    if (e.key === 'Escape') {
      e.preventDefault();
      onClose();
    } else if (e.key === 'ArrowDown') {
      e.preventDefault();
      setActive((a) => Math.min(flat.length - 1, a + 1));
    } else if (e.key === 'ArrowUp') {
      e.preventDefault();
      setActive((a) => Math.max(0, a - 1));
    } else if (e.key === 'Enter' && (e.target as HTMLElement).tagName === 'INPUT') {
      e.preventDefault();
      if (flat[active]) pick(flat[active]);
    } else if (e.key === 'Tab') {
      // keep focus inside the dialog
      const focusable = dialog.current?.querySelectorAll<HTMLElement>('input, select, button');
      if (!focusable || focusable.length === 0) return;
      const first = focusable[0];
      const last = focusable[focusable.length - 1];
      if (e.shiftKey && document.activeElement === first) {
        e.preventDefault();
        last.focus();
      } else if (!e.shiftKey && document.activeElement === last) {
        e.preventDefault();
        first.focus();
      }
    }
  };

  let index = -1;
  return (
    <div className="fixed inset-0 z-50 flex items-start justify-center bg-ink/30 p-4 pt-[8vh]" onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div
        ref={dialog}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        onKeyDown={onKeyDown}
        className="flex max-h-[80vh] w-full max-w-2xl flex-col rounded-lg border border-line-strong bg-panel shadow-2xl"
        data-testid="material-picker"
      >
        <div className="border-b border-line px-4 py-3">
          <div className="flex items-center justify-between">
            <h2 id={titleId} className="text-lg font-semibold">
              Add a layer from the library
            </h2>
            <button type="button" onClick={onClose} className="rounded px-2 py-1 text-sm text-ink-soft hover:bg-paper" aria-label="Close the library">
              Close
            </button>
          </div>
          <div className="mt-2 flex gap-2">
            <input
              ref={search}
              type="search"
              value={query}
              onChange={(e) => setQuery(e.target.value)}
              placeholder="Search by name or class, e.g. “wool” or “board”"
              aria-label="Search materials"
              aria-controls={listId}
              aria-activedescendant={flat[active] ? `${listId}-${flat[active].id}` : undefined}
              className="min-w-0 flex-1 rounded border border-line px-3 py-1.5"
            />
            <label className="flex items-center gap-1 text-sm text-ink-soft">
              <span>Insert</span>
              <select value={place} onChange={(e) => setPlace(e.target.value)} className="rounded border border-line bg-panel px-2 py-1.5 text-sm text-ink" aria-label="Where the new layer goes">
                {places.map((p) => (
                  <option key={p.value} value={p.value}>
                    {p.label}
                  </option>
                ))}
              </select>
            </label>
          </div>
          <p className="mt-1.5 text-xs text-ink-faint">Values are typical values with their source; replace them with the chosen product’s data. ↑ ↓ to choose, Enter to add, Esc to close.</p>
        </div>
        <div className="min-h-0 flex-1 overflow-y-auto px-2 py-2">
          {error ? (
            <p role="alert" className="px-2 py-4 text-sm text-danger">
              {error}
            </p>
          ) : !materials ? (
            <p className="px-2 py-4 text-sm text-ink-soft" role="status">
              Loading the library…
            </p>
          ) : flat.length === 0 ? (
            <p className="px-2 py-4 text-sm text-ink-soft" role="status">
              No material matches “{query}”.
            </p>
          ) : (
            <ul ref={listRef} id={listId} role="listbox" aria-label="Materials">
              {groups.map((g) => (
                <li key={g.cls} role="presentation">
                  <div className="sticky top-0 z-10 flex items-center gap-2 bg-panel px-2 pb-1 pt-2 text-xs font-semibold uppercase tracking-wide text-ink-faint" role="presentation">
                    <span className={`inline-block h-3 w-3 rounded-sm border border-line-strong ${MAT_BG[g.cls]}`} aria-hidden="true" />
                    {CLASS_LABELS[g.cls]}
                  </div>
                  <ul role="group" aria-label={CLASS_LABELS[g.cls]}>
                    {g.items.map((m) => {
                      index += 1;
                      const i = index;
                      return (
                        <li
                          key={m.id}
                          id={`${listId}-${m.id}`}
                          role="option"
                          aria-selected={i === active}
                          data-index={i}
                          onMouseEnter={() => setActive(i)}
                          onClick={() => pick(m)}
                          className={`flex cursor-pointer items-baseline gap-3 rounded px-2 py-1.5 text-sm ${i === active ? 'bg-accent-soft' : ''}`}
                        >
                          <span className="min-w-0 flex-1 truncate">
                            {m.name}
                            {m.teamId ? <span className="ml-2 rounded bg-paper px-1 text-xs text-ink-soft">team</span> : null}
                          </span>
                          <span className="w-24 shrink-0 text-right text-xs tabular text-ink-soft">λ {fixed(m.conductivity, 3)}</span>
                          <span className="w-20 shrink-0 text-right text-xs tabular text-ink-soft">ρ {fixed(m.density, 0)}</span>
                          <span className="w-20 shrink-0 text-right text-xs tabular text-ink-soft">c {fixed(m.specificHeat, 0)}</span>
                        </li>
                      );
                    })}
                  </ul>
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </div>
  );
}
