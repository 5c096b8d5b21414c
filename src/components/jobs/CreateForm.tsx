import { useState, type SubmitEvent, type ReactNode } from 'react';
import { errorOf, send } from '../team/format';

interface Props<T> {
  /** what is made, in lower case: the button reads "New <noun>", the form's submit "Create <noun>" */
  noun: string;
  /** POST endpoint */
  endpoint: string;
  /** the request body from the form's fields */
  body: (form: FormData) => unknown;
  /** where to go with the server's answer once the thing is made */
  next: (answer: T) => string;
  /** the form's fields, given each field's message from the server */
  children: (errors: Record<string, string>) => ReactNode;
}

/** a "New …" button that opens a form; the form posts, shows the server's messages by field, and opens what it made */
export default function CreateForm<T>({ noun, endpoint, body, next, children }: Props<T>) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);

  async function submit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const payload = body(new FormData(e.currentTarget));
    setBusy(true);
    setMessage(null);
    const res = await send('POST', endpoint, payload);
    setBusy(false);
    if (!res.ok) {
      const err = await errorOf(res);
      setErrors(err.fields);
      setMessage(err.message);
      return;
    }
    window.location.href = next((await res.json()) as T);
  }

  if (!open) {
    return (
      <button type="button" className="rounded bg-accent px-3 py-1.5 font-semibold text-white" onClick={() => setOpen(true)}>
        New {noun}
      </button>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="rounded border border-line bg-panel p-4 space-y-3" aria-label={`New ${noun}`}>
      <h2 className="font-semibold">New {noun}</h2>
      {children(errors)}
      {message ? <p className="text-sm text-danger" role="alert">{message}</p> : null}
      <div className="flex gap-2">
        <button type="submit" disabled={busy} className="rounded bg-accent px-3 py-1.5 font-semibold text-white disabled:opacity-60">
          {busy ? 'Creating…' : `Create ${noun}`}
        </button>
        <button type="button" className="rounded border border-line px-3 py-1.5" onClick={() => { setOpen(false); setErrors({}); setMessage(null); }}>
          Cancel
        </button>
      </div>
    </form>
  );
}
