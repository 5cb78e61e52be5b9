import type { ReactNode } from "react";

/**
 * One key figure in its card: a label, the value, an optional note. `compact` is the smaller card of a panel's
 * figures (a capture's); a number, or any value marked `numeric`, is set in tabular figures.
 */
export function StatBlock({
  label,
  value,
  note,
  numeric = typeof value === "number",
  compact = false,
}: {
  label: ReactNode;
  value: ReactNode;
  note?: ReactNode;
  numeric?: boolean;
  compact?: boolean;
}) {
  return (
    <div className={`rounded-md border border-line bg-panel ${compact ? "px-3 py-2" : "px-4 py-3"}`}>
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd
        className={`${compact ? "mt-0.5 text-sm" : "mt-1 text-lg leading-7 text-ink"} ${numeric ? "num font-mono" : "font-medium"}`}
      >
        {value}
      </dd>
      {note ? <dd className="text-xs text-ink-faint">{note}</dd> : null}
    </div>
  );
}

/** The short row of key figures that opens a page (DESIGN.md, Layout). */
export function StatBlocks({ items }: { items: { label: string; value: ReactNode; note?: ReactNode }[] }) {
  return (
    <dl className="grid grid-cols-[repeat(auto-fill,minmax(11rem,1fr))] gap-3">
      {items.map((item) => (
        <StatBlock key={item.label} label={item.label} value={item.value} note={item.note} />
      ))}
    </dl>
  );
}
