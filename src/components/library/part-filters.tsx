"use client";

import { useEffect, useId, useRef, useState } from "react";
import { technologies, technologyLabels } from "@/lib/library/technologies";
import { parseQuantity } from "@/lib/soa/units";
import type { LibraryState } from "./library-query";
import { Sym } from "./symbols";

const control =
  "h-8 rounded-md border border-line-strong bg-panel px-2 text-sm text-ink placeholder:text-ink-faint " +
  "focus-visible:border-accent focus-visible:outline-1 focus-visible:outline-offset-0 aria-invalid:border-fail";

/** The library's search and filters; every change goes to the URL through `onChange`. */
export function PartFilters({
  state,
  facets,
  onChange,
}: {
  state: LibraryState;
  facets?: { makers: string[]; packages: string[] };
  onChange: (change: Partial<LibraryState>) => void;
}) {
  const id = useId();
  const [q, setQ] = useState(state.q);
  const sent = useRef(state.q);
  const latest = useRef(onChange);
  latest.current = onChange;
  // A search is sent once typing pauses; a change of the URL from elsewhere (clear filters) is taken over.
  useEffect(() => {
    if (state.q !== sent.current) {
      sent.current = state.q;
      setQ(state.q);
    }
  }, [state.q]);
  useEffect(() => {
    const next = q.trim();
    if (next === sent.current) return;
    const timer = setTimeout(() => {
      sent.current = next;
      latest.current({ q: next });
    }, 300);
    return () => clearTimeout(timer);
  }, [q]);

  return (
    <search className="space-y-2 rounded-md border border-line bg-panel p-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="min-w-56 flex-1 text-xs text-ink-muted">
          Search
          <input
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            placeholder="Part number, maker or package"
            className={`${control} mt-1 block w-full`}
          />
        </label>
        <FacetSelect
          label="Maker"
          value={state.maker}
          options={facets?.makers}
          onChange={(maker) => onChange({ maker })}
        />
        <FacetSelect
          label="Package"
          value={state.package}
          options={facets?.packages}
          onChange={(pkg) => onChange({ package: pkg })}
        />
        <label className="text-xs text-ink-muted">
          Status
          <select
            value={state.status}
            onChange={(e) => onChange({ status: e.target.value as LibraryState["status"] })}
            className={`${control} mt-1 block w-32`}
          >
            <option value="">Any</option>
            <option value="draft">Draft</option>
            <option value="verified">Verified</option>
          </select>
        </label>
      </div>
      <div className="flex flex-wrap items-center gap-x-6 gap-y-2">
        <fieldset className="flex flex-wrap items-center gap-1.5">
          <legend className="float-left mr-2 text-xs text-ink-muted">Technology</legend>
          {technologies.map((t) => {
            const on = state.technology.includes(t);
            return (
              <label
                key={t}
                className={`inline-flex h-7 cursor-pointer items-center gap-1.5 rounded-md border px-2 text-xs has-focus-visible:outline-2 has-focus-visible:outline-accent ${
                  on
                    ? "border-accent bg-accent-soft text-accent-strong"
                    : "border-line-strong text-ink-muted hover:text-ink"
                }`}
              >
                <input
                  type="checkbox"
                  className="sr-only"
                  checked={on}
                  onChange={() =>
                    onChange({
                      technology: on ? state.technology.filter((x) => x !== t) : [...state.technology, t],
                    })
                  }
                />
                {technologyLabels[t]}
              </label>
            );
          })}
        </fieldset>
        <fieldset className="flex items-center gap-1.5 text-xs text-ink-muted">
          <legend className="float-left mr-2">
            <Sym main="V" sub="DSS" /> range
          </legend>
          <VoltageBound
            id={`${id}-vmin`}
            label="from"
            value={state.vdsMin}
            onCommit={(vdsMin) => onChange({ vdsMin })}
          />
          <VoltageBound
            id={`${id}-vmax`}
            label="to"
            value={state.vdsMax}
            onCommit={(vdsMax) => onChange({ vdsMax })}
          />
        </fieldset>
        <label className="inline-flex items-center gap-2 text-xs text-ink-muted">
          <input
            type="checkbox"
            checked={state.archived}
            onChange={(e) => onChange({ archived: e.target.checked })}
            className="size-3.5 accent-[var(--color-accent)]"
          />
          Show archived parts only
        </label>
      </div>
    </search>
  );
}

function FacetSelect({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: string;
  options?: string[];
  onChange: (value: string) => void;
}) {
  const list =
    options && value && !options.includes(value) ? [value, ...options] : (options ?? (value ? [value] : []));
  return (
    <label className="text-xs text-ink-muted">
      {label}
      <select
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className={`${control} mt-1 block w-44`}
      >
        <option value="">Any</option>
        {list.map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
    </label>
  );
}

/** A voltage bound typed in engineering notation ("60", "1.2k"), sent when the field is left or Enter is pressed. */
function VoltageBound({
  id,
  label,
  value,
  onCommit,
}: {
  id: string;
  label: string;
  value: string;
  onCommit: (value: string) => void;
}) {
  const [text, setText] = useState(value);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => setText(value), [value]);
  function commit() {
    if (text.trim() === "") {
      setError(null);
      if (value) onCommit("");
      return;
    }
    const parsed = parseQuantity(text, "V");
    if (!parsed.ok || typeof parsed.value !== "number" || parsed.value < 0) {
      setError(parsed.ok ? "Enter a voltage ≥ 0" : `Enter a voltage: ${parsed.reason}`);
      return;
    }
    setError(null);
    const next = String(parsed.value);
    if (next !== value) onCommit(next);
  }
  return (
    <span className="relative inline-flex items-center gap-1">
      <label htmlFor={id}>{label}</label>
      <span className="relative">
        <input
          id={id}
          value={text}
          inputMode="decimal"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => setText(e.target.value)}
          onBlur={commit}
          onKeyDown={(e) => {
            if (e.key === "Enter") commit();
          }}
          className={`${control} h-7 w-20 pr-6 text-right font-mono text-xs`}
        />
        <span className="pointer-events-none absolute top-1/2 right-2 -translate-y-1/2 text-xs text-ink-faint">
          V
        </span>
      </span>
      {error ? (
        <span id={`${id}-error`} role="alert" className="text-xs text-fail">
          {error}
        </span>
      ) : null}
    </span>
  );
}
