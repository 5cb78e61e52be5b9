import { Sym } from "@/components/library/symbols";
import { Table, Td, Th, Tr } from "@/components/table";
import { VerdictBadge } from "@/components/verdict-shape";
import type { MeasurementPreview } from "../api";
import { percent, q, repeatText } from "../format";

/** Evidence beyond the part's ratings is kept and checked, and said so beside its verdict. */
function beyond(flags: readonly string[] | undefined): string | null {
  const words = [
    flags?.includes("over-voltage") ? "V above V(BR)DSS" : null,
    flags?.includes("over-current") ? "I above I_DM" : null,
  ].filter(Boolean);
  return words.length ? `beyond rating: ${words.join(", ")}` : null;
}

/** The pasted rows as read: each row's values, its verdict against every candidate, or what is wrong with it. */
export function PreviewTable({ preview }: { preview: MeasurementPreview }) {
  const { candidates, rows } = preview;
  return (
    <Table label="Preview of the pasted rows">
      <thead>
        <tr>
          <Th numeric className="w-14">
            Row
          </Th>
          <Th>Label</Th>
          <Th>Shape</Th>
          <Th numeric>
            <Sym main="V" sub="DS" />
          </Th>
          <Th numeric>
            <Sym main="I" sub="D" />
          </Th>
          <Th numeric>Width</Th>
          <Th>Repetition</Th>
          {candidates.map((c) => (
            <Th key={c.partId}>{c.partNumber}</Th>
          ))}
          {candidates.length === 0 ? <Th>Check</Th> : null}
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => {
          const bad = row.errors.length > 0;
          return (
            <Tr key={row.row} className={bad ? "bg-sunken" : ""}>
              <Td numeric>{row.row}</Td>
              <Td className="font-medium">{row.label}</Td>
              <Td className="text-ink-muted">{row.kind === "rect" ? "rect" : "triangle"}</Td>
              <Td numeric>{q(row.v, "V")}</Td>
              <Td numeric>{q(row.i, "A")}</Td>
              <Td numeric>{q(row.duration, "s")}</Td>
              <Td className="text-ink-muted">{repeatText(row.repeat) ?? "single"}</Td>
              {bad ? (
                <Td
                  colSpan={Math.max(1, candidates.length)}
                  className="whitespace-normal text-fail"
                  data-row-error
                >
                  <ul className="space-y-0.5 py-1 text-xs">
                    {row.errors.map((e) => (
                      <li key={e.message}>
                        {e.column ? <span className="font-mono">{e.column}: </span> : null}
                        {e.reason}
                      </li>
                    ))}
                  </ul>
                </Td>
              ) : candidates.length === 0 ? (
                <Td className="text-ink-muted">no candidates to check against yet</Td>
              ) : (
                candidates.map((c) => {
                  const result = row.verdicts[c.partId];
                  return (
                    <Td key={c.partId} data-verdict={result?.verdict ?? "no-data"} data-part={c.partNumber}>
                      <span className="inline-flex items-baseline gap-2">
                        <VerdictBadge verdict={result?.verdict ?? "no-data"} />
                        {result?.utilisation !== undefined && result.utilisation !== null ? (
                          <span className="num font-mono text-xs text-ink-muted">
                            {percent(result.utilisation)}
                          </span>
                        ) : null}
                        {beyond(result?.flags) ? (
                          <span className="text-xs text-fail" data-beyond-rating>
                            {beyond(result?.flags)}
                          </span>
                        ) : null}
                      </span>
                    </Td>
                  );
                })
              )}
            </Tr>
          );
        })}
      </tbody>
    </Table>
  );
}
