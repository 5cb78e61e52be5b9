import { messageOf } from "@/components/api-client";
import { ConfirmDelete } from "@/components/confirm-delete";
import { DateText } from "@/components/date-text";
import { sizeText } from "@/components/library/format";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { VerdictBadge } from "@/components/verdict-shape";
import type { Verdict } from "@/lib/soa/types";
import { q } from "../format";
import type { CaptureListItem, useCaptures } from "./capture-api";

interface RowActions {
  /** Whether the viewer may delete others' captures too. */
  mayDeleteAny: boolean;
  confirming: string | null;
  removing: boolean;
  onAsk: (id: string) => void;
  onConfirm: (id: string) => void;
  onKeep: () => void;
}

/** The project's captures, newest first, each opening its traces; technicians and up may delete. */
export function CapturesTable({
  list,
  selected,
  canMeasure,
  viewerId,
  worstByPulse,
  names,
  onOpen,
  actions,
}: {
  list: ReturnType<typeof useCaptures>;
  selected: string | null;
  canMeasure: boolean;
  viewerId: string;
  worstByPulse: Record<string, Verdict> | undefined;
  /** Uploaders' names by user id. */
  names: Map<string, string>;
  onOpen: (id: string) => void;
  actions: RowActions;
}) {
  const captures = list.data?.captures ?? [];
  const columns = canMeasure ? 9 : 8;
  return (
    <Table label="Captures">
      <thead>
        <tr>
          <Th>Name</Th>
          <Th numeric>Samples</Th>
          <Th numeric>Peak power</Th>
          <Th numeric>Energy</Th>
          <Th numeric>Equal-energy rectangle</Th>
          <Th>Worst verdict</Th>
          <Th>Uploaded by</Th>
          <Th numeric>When (UTC)</Th>
          {canMeasure ? (
            <Th className="w-32">
              <span className="sr-only">Actions</span>
            </Th>
          ) : null}
        </tr>
      </thead>
      <tbody>
        {list.isPending ? <EmptyRow colSpan={columns}>Loading captures…</EmptyRow> : null}
        {list.isError ? (
          <EmptyRow colSpan={columns}>
            <span role="alert" className="text-fail">
              {messageOf(list.error)}
            </span>
          </EmptyRow>
        ) : null}
        {list.isSuccess && captures.length === 0 ? (
          <EmptyRow colSpan={columns}>
            {canMeasure
              ? "No captures yet. Drop a scope waveform above; you choose its columns before it is sent."
              : "No captures yet. Technicians upload scope waveforms here."}
          </EmptyRow>
        ) : null}
        {captures.map((c) => (
          <CaptureRow
            key={c.id}
            capture={c}
            selected={c.id === selected}
            worst={worstByPulse?.[c.id]}
            mine={c.createdBy === viewerId}
            uploader={c.createdBy ? (names.get(c.createdBy) ?? "a former member") : null}
            onOpen={onOpen}
            actions={canMeasure ? actions : null}
          />
        ))}
      </tbody>
    </Table>
  );
}

function CaptureRow({
  capture: c,
  selected,
  worst,
  mine,
  uploader,
  onOpen,
  actions,
}: {
  capture: CaptureListItem;
  selected: boolean;
  worst: Verdict | undefined;
  mine: boolean;
  uploader: string | null;
  onOpen: (id: string) => void;
  /** Null: the viewer cannot measure, so the row has no actions column. */
  actions: RowActions | null;
}) {
  const eq = c.summary?.equivalent;
  return (
    <Tr className={selected ? "bg-accent-soft" : ""}>
      <Td>
        <button
          type="button"
          aria-current={selected ? "true" : undefined}
          onClick={() => onOpen(c.id)}
          className="font-medium hover:text-accent hover:underline"
        >
          {c.name}
        </button>
        <span className="ml-2 text-xs text-ink-faint">
          {c.fileName}, {sizeText(c.size)}
        </span>
      </Td>
      <Td numeric>{c.summary ? c.summary.samples.toLocaleString("en-GB") : "—"}</Td>
      <Td numeric>{c.summary ? q(c.summary.pPeak, "W") : "—"}</Td>
      <Td numeric>{c.summary ? q(c.summary.energy, "J") : "—"}</Td>
      <Td numeric>
        {!eq ? "—" : eq.ok ? `${q(eq.v, "V")} × ${q(eq.i, "A")}, ${q(eq.duration, "s")}` : "none"}
      </Td>
      <Td>
        {c.status !== "done" ? (
          <StatusWord status={c.status} />
        ) : worst ? (
          <VerdictBadge verdict={worst} />
        ) : (
          <span className="text-ink-faint">—</span>
        )}
      </Td>
      <Td className="text-ink-muted">{c.createdBy ? (mine ? "you" : uploader) : "—"}</Td>
      <Td numeric>
        <DateText value={c.createdAt} withTime />
      </Td>
      {actions ? (
        <Td className="text-right">
          {mine || actions.mayDeleteAny ? (
            <ConfirmDelete
              label={c.name}
              confirming={actions.confirming === c.id}
              pending={actions.removing}
              onAsk={() => actions.onAsk(c.id)}
              onConfirm={() => actions.onConfirm(c.id)}
              onKeep={actions.onKeep}
            />
          ) : null}
        </Td>
      ) : null}
    </Tr>
  );
}

/** A capture not (yet) done, in words. */
function StatusWord({ status }: { status: CaptureListItem["status"] }) {
  const words = { queued: "queued", processing: "processing…", failed: "failed", done: "done" } as const;
  return (
    <span className={status === "failed" ? "text-fail" : "text-ink-muted"} data-capture-status={status}>
      {words[status]}
    </span>
  );
}
