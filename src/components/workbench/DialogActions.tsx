/**
 * the foot of a workbench dialog: the error of the last attempt (if any), then a quiet
 * button that backs out and the accent button that does the thing. with no onPrimary the
 * accent button submits the surrounding form.
 */
export default function DialogActions({
  error,
  cancelLabel,
  onCancel,
  primaryLabel,
  onPrimary,
  busy,
  disabled = false,
}: {
  error: string;
  cancelLabel: string;
  onCancel(): void;
  primaryLabel: string;
  onPrimary?: () => void;
  /** a save is under way: the accent button says so and waits */
  busy: boolean;
  disabled?: boolean;
}) {
  return (
    <>
      {error ? (
        <p role="alert" className="mt-2 rounded bg-danger-soft px-2 py-1.5 text-sm text-danger">
          {error}
        </p>
      ) : null}
      <div className="mt-4 flex justify-end gap-2">
        <button type="button" onClick={onCancel} className="rounded border border-line px-3 py-1.5 text-sm">
          {cancelLabel}
        </button>
        <button
          type={onPrimary ? 'button' : 'submit'}
          onClick={onPrimary}
          disabled={busy || disabled}
          className="rounded bg-accent px-4 py-1.5 text-sm font-semibold text-white disabled:opacity-50"
        >
          {busy ? 'Saving…' : primaryLabel}
        </button>
      </div>
    </>
  );
}
