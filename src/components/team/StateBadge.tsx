import { STATE_CLASS, STATE_LABEL } from './format';

export default function StateBadge({ state }: { state: string }) {
  return (
    <span className={`inline-block rounded border px-2 py-0.5 text-xs font-semibold whitespace-nowrap ${STATE_CLASS[state] ?? ''}`} data-state={state}>
      {STATE_LABEL[state] ?? state}
    </span>
  );
}
