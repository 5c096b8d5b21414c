import { useId, type ReactNode } from 'react';

/**
 * a figure's label with the note on how it is computed: shown on hover and on keyboard focus,
 * and read by screen readers through aria-describedby
 */
export default function Hint({ children, text, className = '' }: { children: ReactNode; text: string; className?: string }) {
  const id = useId();
  return (
    <span className={`group relative inline-flex items-baseline ${className}`}>
      <span tabIndex={0} aria-describedby={id} className="cursor-help underline decoration-dotted decoration-ink-faint underline-offset-2 outline-none focus-visible:outline-2 focus-visible:outline-accent">
        {children}
      </span>
      <span
        role="tooltip"
        id={id}
        className="pointer-events-none invisible absolute left-0 top-full z-30 mt-1 w-72 rounded border border-line-strong bg-ink px-2.5 py-1.5 text-left text-xs font-normal normal-case leading-snug tracking-normal text-paper opacity-0 shadow-lg transition-opacity group-hover:visible group-hover:opacity-100 group-focus-within:visible group-focus-within:opacity-100"
      >
        {text}
      </span>
    </span>
  );
}
