import { useCallback, useMemo, useState } from 'react';
import { flushSync } from 'react-dom';
import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  closestCenter,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
  type ScreenReaderInstructions,
  type UniqueIdentifier,
} from '@dnd-kit/core';
import { SortableContext, sortableKeyboardCoordinates, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { selectFigures, useWorkbench } from '../../lib/workbench/store';
import type { DocLayer } from '../../lib/schemas/workbench';
import LayerCard from './LayerCard';
import SectionDrawing from './SectionDrawing';
import LiveFigures from './LiveFigures';
import MaterialPicker, { type PickerPlace } from './MaterialPicker';

const instructions: ScreenReaderInstructions = {
  draggable:
    'To move a layer, press Space or Enter on its handle, move it with the Up and Down arrow keys, then press Space or Enter again to drop it, or Escape to put it back.',
};

// read the stack when a message is made, so the drag context never re-renders for a new message table
const layersNow = (): DocLayer[] => useWorkbench.getState().doc.layers;
const nameOf = (id: UniqueIdentifier) => layersNow().find((l) => l.id === id)?.name ?? 'the layer';
const posOf = (id: UniqueIdentifier | undefined) => layersNow().findIndex((l) => l.id === id) + 1;
const announcements: Announcements = {
  onDragStart: ({ active }) => `Picked up ${nameOf(active.id)} at position ${posOf(active.id)} of ${layersNow().length}.`,
  onDragOver: ({ active, over }) =>
    over ? `${nameOf(active.id)} is over position ${posOf(over.id)} of ${layersNow().length}.` : `${nameOf(active.id)} is no longer over the stack.`,
  onDragEnd: ({ active, over }) =>
    over
      ? // onDragEnd has already moved the card in the store, so its own position is the new one
        `Moved ${nameOf(active.id)} to position ${posOf(active.id)} of ${layersNow().length}.`
      : `${nameOf(active.id)} was dropped back at position ${posOf(active.id)} of ${layersNow().length}.`,
  onDragCancel: ({ active }) => `Moving was cancelled; ${nameOf(active.id)} stays at position ${posOf(active.id)} of ${layersNow().length}.`,
};
const a11y = { announcements, screenReaderInstructions: instructions };

/** the layer stack (outside at the top), its section drawing, and the live figures under it */
export default function BuildUpPane({ readOnly }: { readOnly: boolean }) {
  const layers = useWorkbench((s) => s.doc.layers);
  const exposure = useWorkbench((s) => s.doc.exposure);
  const figures = useWorkbench(selectFigures);
  const teamId = useWorkbench((s) => s.assembly?.teamId ?? null);
  const moveLayer = useWorkbench((s) => s.moveLayer);
  const addLayer = useWorkbench((s) => s.addLayer);
  const [picking, setPicking] = useState(false);
  const [addedNote, setAddedNote] = useState('');

  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
  // the same array while only values change, so the sortable cards do not all re-render on an edit
  const idKey = layers.map((l) => l.id).join('|');
  const ids = useMemo(() => (idKey ? idKey.split('|') : []), [idKey]);

  const onDragEnd = useCallback(
    ({ active, over }: DragEndEvent) => {
      if (!over || active.id === over.id) return;
      const current = useWorkbench.getState().doc.layers;
      // dnd-kit calls this outside a React event, so the render would wait for a later task
      // (often after the next frame); render the new order now, inside this key or pointer event
      flushSync(() =>
        moveLayer(
          current.findIndex((l) => l.id === active.id),
          current.findIndex((l) => l.id === over.id),
        ),
      );
    },
    [moveLayer],
  );

  const places: PickerPlace[] = useMemo(
    () => [
      { value: 'start', label: 'at the outside face (top)', index: 0 },
      ...layers.slice(0, -1).map((l, i) => ({ value: `after-${l.id}`, label: `after ${i + 1}. ${l.name}`, index: i + 1 })),
      { value: 'end', label: 'at the inside face (bottom)', index: layers.length },
    ],
    [layers],
  );

  return (
    <section aria-labelledby="buildup-title" className="min-w-0">
      <div className="mb-2 flex items-center justify-between gap-2">
        <div>
          <h2 id="buildup-title" className="text-lg font-semibold">
            Build-up
          </h2>
          <p className="text-xs text-ink-soft">Layers from the outside face (top) to the inside face (bottom).</p>
        </div>
        {!readOnly && teamId !== null ? (
          <button
            type="button"
            onClick={() => setPicking(true)}
            className="rounded bg-accent px-3 py-1.5 text-sm font-semibold text-white hover:bg-accent-strong"
            data-testid="add-layer"
          >
            Add layer…
          </button>
        ) : null}
      </div>
      <p className="sr-only" role="status" aria-live="polite">
        {addedNote}
      </p>

      <div className="grid gap-4 xl:grid-cols-[minmax(0,1fr)_minmax(0,40rem)]">
        <div className="grid grid-cols-[minmax(0,1fr)_auto] gap-3">
          <div className="min-w-0">
            <div className="mb-1 flex items-center gap-2 text-xs font-semibold uppercase tracking-wide text-ink-soft" aria-hidden="true">
              <span className="h-px flex-1 bg-line-strong" /> Outside <span className="h-px flex-1 bg-line-strong" />
            </div>
            {layers.length === 0 ? (
              <p className="rounded border border-dashed border-line-strong px-4 py-8 text-center text-sm text-ink-soft">
                No layers yet. {readOnly ? '' : 'Use “Add layer…” to start from the library.'}
              </p>
            ) : (
              <DndContext sensors={sensors} collisionDetection={closestCenter} onDragEnd={onDragEnd} accessibility={a11y}>
                <SortableContext items={ids} strategy={verticalListSortingStrategy}>
                  <ol className="space-y-1.5" aria-label="Layers, outside to inside" data-testid="layer-stack">
                    {layers.map((l, i) => (
                      <LayerCard key={l.id} layer={l} index={i} count={layers.length} readOnly={readOnly} resistance={figures?.layers[i]?.resistance ?? null} />
                    ))}
                  </ol>
                </SortableContext>
              </DndContext>
            )}
            <div className="mt-1 flex items-center gap-2 text-xs font-semibold uppercase tracking-wide text-ink-soft" aria-hidden="true">
              <span className="h-px flex-1 bg-line-strong" /> Inside <span className="h-px flex-1 bg-line-strong" />
            </div>
          </div>
          <SectionDrawing layers={layers} />
        </div>
        <div className="min-w-0">
          <LiveFigures layers={layers} exposure={exposure} figures={figures} />
        </div>
      </div>

      {picking && teamId !== null ? (
        <MaterialPicker
          teamId={teamId}
          places={places}
          onClose={() => setPicking(false)}
          onPick={(m, index) => {
            addLayer(m, index);
            setPicking(false);
            const at = Math.min(index, layers.length) + 1;
            setAddedNote(`Added ${m.name} at position ${at} of ${layers.length + 1}.`);
          }}
        />
      ) : null}
    </section>
  );
}
