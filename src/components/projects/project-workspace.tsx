"use client";

import dynamic from "next/dynamic";
import { type KeyboardEvent, type ReactNode, useRef } from "react";
import { messageOf } from "@/components/api-client";
import { LoadingBox } from "@/components/loading-box";
import { useUrlState } from "@/components/use-url-state";
import { type ProjectCheck, type ProjectDetail, useProject, useProjectCheck } from "./api";
import { ProjectStats } from "./project-stats";
import { ResultsPanel } from "./results/results-panel";

// The tabs not shown at first load with their code when opened: their forms (and zod), the dropzone and the
// trace charts stay out of the page's first load.
const tabLoading = (what: string) => () => <LoadingBox className="h-64">Loading the {what}…</LoadingBox>;
const FaultCasesPanel = dynamic(
  () => import("./fault-cases/fault-cases-panel").then((m) => m.FaultCasesPanel),
  {
    loading: tabLoading("fault cases"),
  },
);
const BenchPanel = dynamic(() => import("./bench/bench-panel").then((m) => m.BenchPanel), {
  loading: tabLoading("bench measurements"),
});
const CapturesPanel = dynamic(() => import("./captures/captures-panel").then((m) => m.CapturesPanel), {
  loading: tabLoading("captures"),
});

export interface Viewer {
  id: string;
  /** Whether the viewer may change measured pulses and captures anyone recorded (`measurement.manage`). */
  managesMeasurements: boolean;
}

export interface Person {
  id: string;
  name: string;
}

const tabs = [
  { key: "results", label: "Results" },
  { key: "fault-cases", label: "Fault cases" },
  { key: "bench", label: "Bench" },
  { key: "captures", label: "Captures" },
] as const;
type TabKey = (typeof tabs)[number]["key"];

export interface PanelProps {
  projectId: string;
  detail: ProjectDetail;
  check: ProjectCheck | undefined;
  viewer: Viewer;
  canWrite: boolean;
  canMeasure: boolean;
  people: Person[];
}

/**
 * The project's work area: its key figures, then the tabs (kept in the URL as ?tab=…) over the results, the
 * fault cases, the bench measurements and the captures. Data comes from the project and check routes through
 * TanStack Query; every change invalidates both.
 */
export function ProjectWorkspace(props: Omit<PanelProps, "detail" | "check">) {
  const [params, setParams] = useUrlState();
  const requested = params.get("tab");
  const tab: TabKey = tabs.some((t) => t.key === requested) ? (requested as TabKey) : "results";
  const detail = useProject(props.projectId);
  const check = useProjectCheck(props.projectId);
  const tabRefs = useRef<Record<string, HTMLButtonElement | null>>({});

  function select(key: TabKey) {
    setParams(key === "results" ? { tab: null } : { tab: key, pulse: null }, { push: true });
  }

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    const index = tabs.findIndex((t) => t.key === tab);
    const step = event.key === "ArrowRight" ? 1 : event.key === "ArrowLeft" ? -1 : 0;
    if (!step) return;
    const next = tabs[(index + step + tabs.length) % tabs.length];
    select(next.key);
    tabRefs.current[next.key]?.focus();
  }

  let body: ReactNode;
  if (detail.isPending) {
    body = (
      <LoadingBox className="h-64">
        Loading the project: candidates, fault cases and measured pulses…
      </LoadingBox>
    );
  } else if (detail.isError) {
    body = (
      <p role="alert" className="text-sm text-fail">
        {messageOf(detail.error)}
      </p>
    );
  } else {
    const panel: PanelProps = { ...props, detail: detail.data, check: check.data };
    body =
      tab === "results" ? (
        <ResultsPanel {...panel} checkError={check.isError ? messageOf(check.error) : null} />
      ) : tab === "fault-cases" ? (
        <FaultCasesPanel {...panel} />
      ) : tab === "bench" ? (
        <BenchPanel {...panel} />
      ) : (
        <CapturesPanel {...panel} />
      );
  }

  return (
    <div className="space-y-6">
      <ProjectStats detail={detail.data} check={check.data} />
      <div>
        <div
          role="tablist"
          aria-label="Project views"
          className="flex gap-1 overflow-x-auto border-b border-line"
          onKeyDown={onKeyDown}
        >
          {tabs.map((t) => (
            <button
              key={t.key}
              ref={(el) => {
                tabRefs.current[t.key] = el;
              }}
              type="button"
              role="tab"
              id={`tab-${t.key}`}
              aria-selected={tab === t.key}
              aria-controls={`panel-${t.key}`}
              tabIndex={tab === t.key ? 0 : -1}
              onClick={() => select(t.key)}
              className={`-mb-px h-11 shrink-0 border-b-2 px-3 text-sm whitespace-nowrap lg:h-9 ${
                tab === t.key
                  ? "border-accent font-medium text-ink"
                  : "border-transparent text-ink-muted hover:border-line-strong hover:text-ink"
              }`}
            >
              {t.label}
            </button>
          ))}
        </div>
        <div role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`} className="pt-6">
          {body}
        </div>
      </div>
    </div>
  );
}
