/** the React twin of Caution.astro: the short caution every result carries (design.md, Cautions) */
export default function CautionNote({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      className={`rounded border border-warn/30 bg-warn-soft text-ink ${compact ? 'px-3 py-2 text-sm' : 'px-4 py-3'}`}
      role="note"
      aria-label="Caution"
      data-testid="caution"
    >
      <strong className="font-semibold">Design aid, not a design.</strong> Results describe one-dimensional heat flow through plane layers. Thermal
      bridges, moisture storage, air leakage and workmanship are not modelled. Material values are typical values to be replaced with product data.
      The design must follow local codes and be checked by a qualified professional.
    </aside>
  );
}
