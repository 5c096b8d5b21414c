import type { InputHTMLAttributes, ReactNode } from 'react';

interface Props extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  error?: string;
  hint?: ReactNode;
}

/** a labelled input with its hint and its error, tied together for screen readers */
export default function Field({ label, name, error, hint, className, ...input }: Props) {
  const id = `f-${name}`;
  return (
    <label htmlFor={id} className={`block text-sm ${className ?? ''}`}>
      <span className="font-semibold text-ink">{label}</span>
      <input
        id={id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`mt-1 block w-full rounded border bg-panel px-2 py-1.5 ${error ? 'border-danger' : 'border-line'}`}
        {...input}
      />
      {hint && !error ? (
        <span id={`${id}-hint`} className="mt-0.5 block text-xs text-ink-faint">
          {hint}
        </span>
      ) : null}
      {error ? (
        <span id={`${id}-error`} className="mt-0.5 block text-xs text-danger" role="alert">
          {error}
        </span>
      ) : null}
    </label>
  );
}
