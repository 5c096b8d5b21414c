import { useId, useState } from 'react';
import Modal from './Modal';
import DialogActions from './DialogActions';

/** the note of a new revision, then save */
export default function SaveDialog({ nextNumber, saving, error, onSave, onCancel }: { nextNumber: number; saving: boolean; error: string; onSave(note: string): void; onCancel(): void }) {
  const [note, setNote] = useState('');
  const id = useId();
  const tooLong = note.length > 2000;
  return (
    <Modal title={`Save as revision ${nextNumber}`} onClose={onCancel} testId="save-dialog">
      <form
        className="mt-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (!tooLong && !saving) onSave(note.trim());
        }}
      >
        <div>
          <label htmlFor={id} className="block text-sm font-semibold">
            Note <span className="font-normal text-ink-soft">(what changed and why; optional)</span>
          </label>
          <textarea
            id={id}
            value={note}
            onChange={(e) => setNote(e.target.value)}
            rows={3}
            aria-invalid={tooLong || undefined}
            aria-describedby={tooLong ? `${id}-err` : undefined}
            className="mt-1 w-full rounded border border-line px-2 py-1.5 text-sm"
            placeholder="e.g. insulation moved outside the brick; 120 mm stone wool"
          />
          {tooLong ? (
            <p id={`${id}-err`} className="text-xs font-semibold text-danger">
              Note must be at most 2000 characters (it has {note.length}).
            </p>
          ) : null}
        </div>
        <DialogActions error={error} cancelLabel="Cancel" onCancel={onCancel} primaryLabel={`Save revision ${nextNumber}`} busy={saving} disabled={tooLong} />
      </form>
    </Modal>
  );
}
