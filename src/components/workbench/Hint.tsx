import { useId, type ReactNode } from 'react';

/**
 * a figure's label with the note on how it is computed: shown on hover and on keyboard focus,
 * and read by screen readers through aria-describedby
 */
export default function Hint({ children, text, className = '', align = 'left' }: { children: ReactNode; text: string; className?: string; align?: 'left' | 'right' }) {
  const id = useId();
  return (
    <span className={`group relative inline-flex items-baseline ${className}`}>
      <span tabIndex={0} aria-describedby={id} className="cursor-help underline decoration-dotted decoration-ink-faint underline-offset-2 outline-none focus-visible:outline-2 focus-visible:outline-accent">
        {children}
      </span>
      <span
        role="tooltip"
        id={id}
        // display:none while hidden, so a tooltip near the edge never widens the page
        className={`pointer-events-none absolute top-full z-30 mt-1 hidden w-72 rounded border border-line-strong bg-ink px-2.5 py-1.5 text-left text-xs font-normal normal-case leading-snug tracking-normal text-paper shadow-lg group-hover:block group-focus-within:block ${
          align === 'right' ? 'right-0' : 'left-0'
        }`}
      >
        {text}
      </span>
    </span>
  );
}
