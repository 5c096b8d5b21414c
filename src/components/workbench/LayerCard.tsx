import { memo, useId } from 'react';
import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { useWorkbench } from '../../lib/workbench/store';
import { draftKey, FIELD_SPECS, showLayerField, type LayerField } from '../../lib/workbench/fields';
import { CLASS_LABELS } from '../../lib/materials/builtin';
import type { DocLayer } from '../../lib/schemas/workbench';
import { fixed } from './format';
import { MAT_BG } from './materialStyle';

const NUMERIC_FIELDS: Exclude<LayerField, 'name'>[] = ['thickness', 'conductivity', 'density', 'specificHeat', 'vapourResistanceFactor'];
const SHORT_LABELS: Record<Exclude<LayerField, 'name'>, string> = {
  thickness: 'd',
  conductivity: 'λ',
  density: 'ρ',
  specificHeat: 'c',
  vapourResistanceFactor: 'μ',
};

/** one input of a card: shows the typed text and its message while it is not valid */
const FieldInput = memo(function FieldInput({
  layer,
  field,
  readOnly,
  label,
  symbol,
  unit,
  wide = false,
}: {
  layer: DocLayer;
  field: LayerField;
  readOnly: boolean;
  label: string;
  symbol?: string;
  unit?: string;
  wide?: boolean;
}) {
  const key = draftKey(layer.id, field);
  const draft = useWorkbench((s) => s.drafts[key]);
  const editField = useWorkbench((s) => s.editField);
  const endEdit = useWorkbench((s) => s.endEdit);
  const id = useId();
  const value = draft ? draft.raw : showLayerField(layer, field);
  const error = draft?.error ?? null;
  return (
    <div className={wide ? 'min-w-0 flex-1' : 'min-w-0'}>
      <label htmlFor={id} className="block truncate text-[11px] font-semibold text-ink-faint" title={unit ? `${label} (${unit})` : label}>
        {symbol ? (
          <>
            <span aria-hidden="true">{symbol}</span>
            <span className="sr-only">{label}</span>
          </>
        ) : (
          label
        )}
        {unit ? <span className="ml-1 font-normal">{unit}</span> : null}
      </label>
      <input
        id={id}
        name={field}
        type="text"
        inputMode={field === 'name' ? 'text' : 'decimal'}
        autoComplete="off"
        spellCheck={field === 'name'}
        readOnly={readOnly}
        value={value}
        // a long material name is cut by the box; the tooltip shows it whole
        title={field === 'name' ? value : undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        data-field={field}
        onChange={(e) => editField(layer.id, field, e.target.value)}
        onBlur={() => endEdit(key)}
        className={`mt-0.5 w-full rounded border bg-panel px-2 py-1 text-sm ${field === 'name' ? 'font-semibold' : 'tabular text-right'} ${
          error ? 'border-danger bg-danger-soft' : 'border-line focus:border-accent'
        } ${readOnly ? 'cursor-default bg-paper' : ''}`}
      />
      {error ? (
        <p id={`${id}-error`} role="alert" className="mt-0.5 text-xs font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
});

export interface LayerCardProps {
  layer: DocLayer;
  index: number;
  count: number;
  readOnly: boolean;
  /** R = d/λ from analyse(), m²K/W */
  resistance: number | null;
}

function LayerCard({ layer, index, count, readOnly, resistance }: LayerCardProps) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: layer.id, disabled: readOnly });
  const highlighted = useWorkbench((s) => s.highlightedId === layer.id);
  const setHighlighted = useWorkbench((s) => s.setHighlighted);
  const style = { transform: CSS.Translate.toString(transform), transition };
  return (
    <li
      ref={setNodeRef}
      style={style}
      data-testid="layer-card"
      data-layer-id={layer.id}
      data-name={layer.name}
      aria-label={`Layer ${index + 1} of ${count}: ${layer.name}`}
      onPointerEnter={() => setHighlighted(layer.id)}
      onPointerLeave={() => setHighlighted(null)}
      onFocus={() => setHighlighted(layer.id)}
      onBlur={(e) => {
        if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setHighlighted(null);
      }}
      className={`relative rounded-md border bg-panel shadow-sm ${isDragging ? 'z-20 opacity-90 shadow-lg ring-2 ring-accent' : ''} ${
        highlighted ? 'border-accent ring-1 ring-accent' : 'border-line'
      }`}
    >
      <CardBody
        layer={layer}
        index={index}
        count={count}
        readOnly={readOnly}
        resistance={resistance}
        attributes={attributes}
        listeners={listeners}
        setActivatorNodeRef={setActivatorNodeRef}
      />
    </li>
  );
}

type SortableParts = Pick<ReturnType<typeof useSortable>, 'attributes' | 'listeners' | 'setActivatorNodeRef'>;

/**
 * everything inside the card; dnd-kit re-renders every sortable item when a drag starts or ends,
 * and this part only needs to follow its own layer, place and handle props
 */
const CardBody = memo(function CardBody({ layer, index, count, readOnly, resistance, attributes, listeners, setActivatorNodeRef }: LayerCardProps & SortableParts) {
  const duplicateLayer = useWorkbench((s) => s.duplicateLayer);
  const removeLayer = useWorkbench((s) => s.removeLayer);
  const edited = layer.materialRef === null && layer.source !== '';
  return (
    <div className="flex items-stretch">
      <div className={`w-2 shrink-0 rounded-l-md ${MAT_BG[layer.materialClass]}`} aria-hidden="true" />
      {!readOnly ? (
        <button
          type="button"
          ref={setActivatorNodeRef}
          {...attributes}
          {...listeners}
          aria-label={`Move ${layer.name} (position ${index + 1} of ${count})`}
          data-testid="drag-handle"
          className="flex w-7 shrink-0 cursor-grab touch-none items-center justify-center text-ink-faint hover:bg-paper hover:text-ink active:cursor-grabbing"
        >
          <svg width="10" height="16" viewBox="0 0 10 16" aria-hidden="true">
            {[2, 8, 14].map((y) => (
              <g key={y}>
                <circle cx="2.5" cy={y} r="1.4" fill="currentColor" />
                <circle cx="7.5" cy={y} r="1.4" fill="currentColor" />
              </g>
            ))}
          </svg>
        </button>
      ) : null}
      <div className="min-w-0 flex-1 px-2.5 py-2">
        <div className="flex items-start gap-2">
          <span className="mt-5 w-5 shrink-0 text-right text-xs font-semibold text-ink-faint tabular" aria-hidden="true">
            {index + 1}
          </span>
          <FieldInput layer={layer} field="name" readOnly={readOnly} label="Layer" wide />
          <div className="mt-4 shrink-0 text-right text-xs leading-tight text-ink-soft">
            <div>
              <span className={`mr-1 inline-block h-2.5 w-2.5 rounded-sm border border-line-strong ${MAT_BG[layer.materialClass]} align-middle`} aria-hidden="true" />
              {CLASS_LABELS[layer.materialClass]}
            </div>
            <div className="tabular" title="Thermal resistance of the layer, R = d/λ">
              R {fixed(resistance, 3)} m²K/W
            </div>
          </div>
        </div>
        <div className="mt-1.5 grid grid-cols-5 gap-1.5 pl-7">
          {NUMERIC_FIELDS.map((f) => (
            <FieldInput
              key={f}
              layer={layer}
              field={f}
              readOnly={readOnly}
              label={FIELD_SPECS[f].label}
              symbol={SHORT_LABELS[f]}
              unit={FIELD_SPECS[f].unit === '–' ? undefined : FIELD_SPECS[f].unit}
            />
          ))}
        </div>
        <div className="mt-1.5 flex items-end gap-2 pl-7">
          <details className="min-w-0 flex-1 text-xs text-ink-soft">
            <summary className="cursor-pointer select-none truncate">
              {edited ? <><span className="mr-1 rounded bg-warn-soft px-1 font-semibold text-warn">values edited</span>{' '}</> : null}
              Source: {layer.source || 'none given'}
            </summary>
            <p className="mt-1 whitespace-pre-line">{layer.source || 'No source given for these values.'}</p>
            {layer.note ? <p className="mt-1 whitespace-pre-line text-ink">{layer.note}</p> : null}
          </details>
          {!readOnly ? (
            <div className="flex shrink-0 gap-1">
              <button
                type="button"
                onClick={() => duplicateLayer(layer.id)}
                aria-label={`Duplicate ${layer.name}`}
                className="rounded border border-line px-2 py-0.5 text-xs text-ink-soft hover:border-accent hover:text-accent-strong"
              >
                Duplicate
              </button>
              <button
                type="button"
                onClick={() => removeLayer(layer.id)}
                aria-label={`Remove ${layer.name}`}
                className="rounded border border-line px-2 py-0.5 text-xs text-ink-soft hover:border-danger hover:text-danger"
              >
                Remove
              </button>
            </div>
          ) : null}
        </div>
      </div>
    </div>
  );
});

export default memo(LayerCard);
