import { useEffect, useId, useRef, type ReactNode } from 'react';

/** a small modal dialog: focus moves in, Tab stays inside, Escape closes, focus returns to the opener */
export default function Modal({ title, onClose, children, testId }: { title: string; onClose(): void; children: ReactNode; testId?: string }) {
  const ref = useRef<HTMLDivElement>(null);
  const titleId = useId();
  useEffect(() => {
    const opener = document.activeElement as HTMLElement | null;
    const first = ref.current?.querySelector<HTMLElement>('textarea, input, button');
    first?.focus();
    return () => opener?.focus?.();
  }, []);
  return (
    <div className="fixed inset-0 z-50 flex items-start justify-center bg-ink/30 p-4 pt-[12vh]">
      <div
        ref={ref}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        data-testid={testId}
        className="w-full max-w-lg rounded-lg border border-line-strong bg-panel p-4 shadow-2xl"
        onKeyDown={(e) => {
          if (e.key === 'Escape') {
            e.preventDefault();
            onClose();
          } else if (e.key === 'Tab') {
            const f = ref.current?.querySelectorAll<HTMLElement>('textarea, input, button:not([disabled]), a[href]');
            if (!f || f.length === 0) return;
            if (e.shiftKey && document.activeElement === f[0]) {
              e.preventDefault();
              f[f.length - 1].focus();
            } else if (!e.shiftKey && document.activeElement === f[f.length - 1]) {
              e.preventDefault();
              f[0].focus();
            }
          }
        }}
      >
        <h2 id={titleId} className="text-lg font-semibold">
          {title}
        </h2>
        {children}
      </div>
    </div>
  );
}
