// asks before a share link is withdrawn: a dialog of our own (focus kept inside, Escape cancels)
import Modal from '../workbench/Modal';
import type { ShareRow } from '../../lib/schemas/rows';
import type { Wire } from '../../lib/schemas/rows';

export default function RevokeDialog({ share, onCancel, onConfirm }: { share: Wire<ShareRow>; onCancel(): void; onConfirm(): void }) {
  return (
    <Modal title="Withdraw this share link?" onClose={onCancel} testId="revoke-dialog">
      <p className="mt-2 text-sm">
        {share.label ? <>The link “{share.label}”</> : 'This link'} has been opened {share.openCount} {share.openCount === 1 ? 'time' : 'times'}. Once withdrawn, anyone holding it sees a page saying
        it was withdrawn; this cannot be undone, but you can make a new link.
      </p>
      <div className="mt-4 flex justify-end gap-2">
        <button type="button" className="rounded border border-line bg-panel px-3 py-1.5 text-sm" onClick={onCancel}>
          Keep the link
        </button>
        <button type="button" className="rounded bg-danger px-3 py-1.5 text-sm font-semibold text-white" onClick={onConfirm} data-testid="revoke-confirm">
          Withdraw the link
        </button>
      </div>
    </Modal>
  );
}
