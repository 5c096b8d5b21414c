import Modal from './Modal';
import DialogActions from './DialogActions';
import type { StaleInfo } from './Workbench';

/** a save met a newer revision: say what it changed, then save on top of it or keep editing */
export default function StaleDialog({ stale, saving, error, onSaveOnTop, onKeepEditing }: { stale: StaleInfo; saving: boolean; error: string; onSaveOnTop(): void; onKeepEditing(): void }) {
  const { head, diff } = stale;
  const when = new Date(head.createdAt).toLocaleString('en-GB');
  const lines: string[] = [];
  if (diff) {
    for (const n of diff.added) lines.push(`has the layer ${n}, which yours does not`);
    for (const n of diff.removed) lines.push(`has no layer ${n}, which yours has`);
    for (const c of diff.changed) lines.push(`has a different ${c.fields.join(', ')} for ${c.name}`);
    if (diff.reordered) lines.push('has the shared layers in another order');
    if (diff.exposureChanged) lines.push('has other exposure settings');
  }
  return (
    <Modal title={`Revision ${head.number} was saved meanwhile`} onClose={onKeepEditing} testId="stale-dialog">
      <p className="mt-2 text-sm text-ink-soft">
        {head.authorName ?? 'Someone'} saved revision {head.number} at {when}, after you opened this build-up.
      </p>
      {diff ? (
        lines.length ? (
          <div className="mt-2 text-sm">
            <p className="font-semibold">Compared with yours, revision {head.number}:</p>
            <ul className="mt-1 list-disc space-y-0.5 pl-5">
              {lines.map((l) => (
                <li key={l}>{l}</li>
              ))}
            </ul>
          </div>
        ) : (
          <p className="mt-2 text-sm">Its build-up and exposure are the same as yours.</p>
        )
      ) : (
        <p className="mt-2 text-sm">Its build-up could not be compared with yours.</p>
      )}
      <p className="mt-2 text-sm">Saving on top keeps their revision in the history and makes yours the newest; nothing is lost either way.</p>
      <DialogActions error={error} cancelLabel="Keep editing" onCancel={onKeepEditing} primaryLabel={`Save on top as revision ${head.number + 1}`} onPrimary={onSaveOnTop} busy={saving} />
    </Modal>
  );
}
