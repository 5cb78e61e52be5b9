/**
 * A date as engineers read it in a table: ISO order, tabular figures, UTC. The full instant is in the title
 * and the datetime attribute.
 */
export function DateText({ value, withTime = false }: { value: Date | string | null; withTime?: boolean }) {
  if (!value) return <span className="text-ink-faint">—</span>;
  const date = typeof value === "string" ? new Date(value) : value;
  const iso = date.toISOString();
  const text = withTime ? `${iso.slice(0, 10)} ${iso.slice(11, 16)}` : iso.slice(0, 10);
  return (
    <time
      dateTime={iso}
      title={`${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`}
      className="num font-mono text-xs"
    >
      {text}
    </time>
  );
}
