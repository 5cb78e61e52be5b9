"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { FormMessage } from "@/components/form";
import { BUILDER_NAMES } from "@/lib/vocabulary";
import { invalidateProject, type ProjectDetail } from "../api";
import type { BuiltCase } from "./builder-layout";
import { ClampBuilder } from "./clamp-builder";
import { CurrentLimitBuilder } from "./current-limit-builder";
import { InrushBuilder } from "./inrush-builder";
import { SequenceBuilder } from "./sequence-builder";
import { TripWindowBuilder } from "./trip-window-builder";

const builders = (Object.keys(BUILDER_NAMES) as (keyof typeof BUILDER_NAMES)[]).map((key) => ({
  key,
  label: BUILDER_NAMES[key],
}));
type BuilderKey = keyof typeof BUILDER_NAMES;

/**
 * The pulse builders: fault cases derived from the circuit by the engine's formulas (METHODS.md §11), each showing
 * its intermediate figures as it is filled in. The trip window hands its maximum to the builders that need it.
 */
export function BuilderPanel({ projectId, detail }: { projectId: string; detail: ProjectDetail }) {
  const queryClient = useQueryClient();
  const [current, setCurrent] = useState<BuilderKey>("inrush");
  const [carried, setCarried] = useState<{ target: BuilderKey; amps: string; stamp: number } | null>(null);
  const [created, setCreated] = useState<string | null>(null);

  async function create(built: BuiltCase) {
    setCreated(null);
    await requestJson("POST", `/api/projects/${projectId}/fault-cases`, built);
    await invalidateProject(queryClient, projectId);
    setCreated(built.name);
  }

  return (
    <div className="space-y-3">
      <fieldset className="inline-flex rounded-md border border-line-strong bg-panel p-0.5">
        <legend className="sr-only">Pulse builder</legend>
        {builders.map((b) => (
          <label
            key={b.key}
            className="inline-flex h-8 cursor-pointer items-center rounded px-3 text-sm text-ink-muted hover:text-ink has-checked:bg-accent-soft has-checked:font-medium has-checked:text-accent-strong has-focus-visible:outline-2 has-focus-visible:outline-accent"
          >
            <input
              type="radio"
              name="builder"
              value={b.key}
              checked={current === b.key}
              onChange={() => {
                setCurrent(b.key);
                setCreated(null);
              }}
              className="sr-only"
            />
            {b.label}
          </label>
        ))}
      </fieldset>
      {current === "inrush" ? <InrushBuilder create={create} /> : null}
      {current === "current-limit" ? (
        <CurrentLimitBuilder
          key={carried?.target === "current-limit" ? carried.stamp : "plain"}
          create={create}
          currentLimit={carried?.target === "current-limit" ? carried.amps : undefined}
        />
      ) : null}
      {current === "trip-window" ? (
        <TripWindowBuilder
          onUse={(target, amps) => {
            setCarried({ target, amps, stamp: Date.now() });
            setCurrent(target);
          }}
        />
      ) : null}
      {current === "clamp" ? (
        <ClampBuilder
          key={carried?.target === "clamp" ? carried.stamp : "plain"}
          create={create}
          tripCurrent={carried?.target === "clamp" ? carried.amps : undefined}
        />
      ) : null}
      {current === "sequence" ? <SequenceBuilder create={create} detail={detail} /> : null}
      {created ? (
        <FormMessage tone="done">
          Fault case &ldquo;{created}&rdquo; created; the results include it.
        </FormMessage>
      ) : null}
    </div>
  );
}
