import type { ReactNode } from "react";

/** The short row of key figures that opens a page (DESIGN.md, Layout). */
export function StatBlocks({ items }: { items: { label: string; value: ReactNode; note?: ReactNode }[] }) {
  return (
    <dl className="grid grid-cols-[repeat(auto-fill,minmax(11rem,1fr))] gap-3">
      {items.map((item) => (
        <div key={item.label} className="rounded-md border border-line bg-panel px-4 py-3">
          <dt className="text-xs text-ink-muted">{item.label}</dt>
          <dd
            className={`mt-1 text-lg leading-7 text-ink ${typeof item.value === "number" ? "num font-mono" : "font-medium"}`}
          >
            {item.value}
          </dd>
          {item.note ? <dd className="text-xs text-ink-faint">{item.note}</dd> : null}
        </div>
      ))}
    </dl>
  );
}
