// a progress value that only its bar listens to: a long job reports often, and re-rendering the
// whole page (tables, charts) for each report would take the main thread from the user
import { useSyncExternalStore } from 'react';

/** a fraction 0…1, published at most once per animation frame */
export class ProgressSignal {
  private value = 0;
  private frame = 0;
  private pending = 0;
  private readonly listeners = new Set<() => void>();

  set(fraction: number): void {
    this.pending = fraction;
    if (this.frame) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.value = this.pending;
      this.listeners.forEach((l) => l());
    });
  }

  /** back to 0 at once (a new job) */
  reset(): void {
    if (this.frame) cancelAnimationFrame(this.frame);
    this.frame = 0;
    this.pending = 0;
    this.value = 0;
    this.listeners.forEach((l) => l());
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  get = (): number => this.value;
}

export default function ProgressBar({ signal, label }: { signal: ProgressSignal; label: string }) {
  const pct = Math.round(useSyncExternalStore(signal.subscribe, signal.get) * 100);
  return (
    <>
      <span role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="block h-2 w-48 overflow-hidden rounded bg-line">
        <span className="block h-full bg-accent" style={{ width: `${pct}%` }} />
      </span>
      <span className="w-10 tabular text-ink-soft">{pct} %</span>
    </>
  );
}
