/** What a workspace page shows while its data loads: the shape of a title, stat blocks and a table. */
export function PageSkeleton() {
  return (
    <div role="status" aria-busy="true" aria-label="Loading" className="animate-pulse">
      <div className="h-7 w-40 rounded bg-sunken" />
      <div className="mt-6 grid grid-cols-[repeat(auto-fill,minmax(11rem,1fr))] gap-3">
        {[0, 1, 2].map((k) => (
          <div key={k} className="h-[4.25rem] rounded-md border border-line bg-panel" />
        ))}
      </div>
      <div className="mt-8 h-48 rounded-md border border-line bg-panel" />
    </div>
  );
}
