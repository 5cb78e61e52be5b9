"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { type KeyboardEvent, useId, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";

import { useDebounced } from "@/components/use-debounced";
import { q } from "@/lib/format";

interface PartOption {
  id: string;
  partNumber: string;
  maker: string;
  package: string;
  vdsMax: number;
  rdsOn: number | null;
  status: "draft" | "verified";
}

/**
 * A search over the workspace's library (part number, maker or package) as a combobox: type, move with the
 * arrow keys, Enter or a click adds the part. Parts that already are candidates are left out.
 */
export function PartPicker({
  exclude,
  busy,
  onPick,
}: {
  exclude: ReadonlySet<string>;
  busy: boolean;
  onPick: (part: { id: string; partNumber: string }) => void;
}) {
  const id = useId();
  const [text, setText] = useState("");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const sent = useDebounced(text.trim(), 200);
  const search = useQuery({
    queryKey: ["part-picker", sent],
    queryFn: () =>
      requestJson<{ rows: PartOption[] }>(
        "GET",
        `/api/parts?${new URLSearchParams({ q: sent, pageSize: "12" })}`,
      ),
    enabled: open,
    placeholderData: keepPreviousData,
  });
  const options = (search.data?.rows ?? []).filter((p) => !exclude.has(p.id)).slice(0, 8);
  const listId = `${id}-list`;

  function pick(option: PartOption | undefined) {
    if (!option) return;
    onPick(option);
    setText("");
    setActive(0);
  }

  function onKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    if (event.key === "ArrowDown") {
      event.preventDefault();
      setOpen(true);
      setActive((k) => Math.min(options.length - 1, k + 1));
    } else if (event.key === "ArrowUp") {
      event.preventDefault();
      setActive((k) => Math.max(0, k - 1));
    } else if (event.key === "Enter") {
      event.preventDefault();
      pick(options[active]);
    } else if (event.key === "Escape") {
      setOpen(false);
    }
  }

  return (
    <div className="relative w-full max-w-md">
      <label htmlFor={id} className="text-sm font-medium">
        Add a candidate
      </label>
      <input
        id={id}
        type="search"
        aria-controls={open ? listId : undefined}
        aria-describedby={`${id}-hint`}
        autoComplete="off"
        placeholder="Search the library: part number, maker, package"
        value={text}
        disabled={busy}
        onChange={(e) => {
          setText(e.target.value);
          setActive(0);
          setOpen(true);
        }}
        onFocus={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        onKeyDown={onKeyDown}
        className="mt-1 block h-9 w-full rounded-md border border-line-strong bg-panel px-2.5 text-sm placeholder:text-ink-faint focus-visible:border-accent focus-visible:outline-1 focus-visible:outline-offset-0"
      />
      <p id={`${id}-hint`} className="sr-only">
        Arrow keys move through the matches; Enter adds the highlighted part.
      </p>
      {open ? (
        <div className="absolute inset-x-0 top-full z-30 mt-1 overflow-hidden rounded-md border border-line-strong bg-panel shadow-lg">
          {search.isError ? (
            <p role="alert" className="px-3 py-2 text-sm text-fail">
              {messageOf(search.error)}
            </p>
          ) : options.length === 0 ? (
            <p className="px-3 py-2 text-sm text-ink-muted">
              {search.isFetching
                ? "Searching…"
                : sent
                  ? "No other part matches."
                  : "Every library part is already a candidate."}
            </p>
          ) : null}
          <ul id={listId} aria-label="Matching library parts">
            {options.map((option, k) => (
              <li key={option.id}>
                <button
                  type="button"
                  tabIndex={-1}
                  onPointerDown={(e) => e.preventDefault()}
                  onClick={() => pick(option)}
                  onPointerEnter={() => setActive(k)}
                  aria-label={`Add ${option.partNumber}`}
                  className={`flex w-full items-baseline justify-between gap-3 px-3 py-1.5 text-left text-sm ${
                    k === active ? "bg-accent-soft" : ""
                  }`}
                >
                  <span>
                    <span className="font-medium">{option.partNumber}</span>{" "}
                    <span className="text-ink-muted">{option.maker}</span>
                  </span>
                  <span className="num font-mono text-xs text-ink-muted">
                    {q(option.vdsMax, "V")} · {option.package} · {option.status}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
