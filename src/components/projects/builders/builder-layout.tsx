import type { ReactNode } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { Button, FormMessage } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { q, repeatText } from "@/lib/format";
import type { StoredShape } from "@/lib/projects/pulse-columns";
import type { Repeat } from "@/lib/soa/types";
import { shapeWords } from "@/lib/vocabulary";
import { FigureList } from "./figures";

/** The pulse a builder makes: a rectangle or triangle, an unclamped turn-off, or a fault sequence's samples. */
export type BuiltPulse =
  | { kind: StoredShape; v: number; i: number; duration: number; repeat: Repeat | null }
  | { kind: "avalanche"; supply: number; current: number; inductance: number }
  | { kind: "waveform"; samples: { t: number[]; v: number[]; i: number[] } };

/** A fault case as a builder makes it, with where it came from. */
export type BuiltCase = BuiltPulse & {
  name: string;
  origin: { builder: string; input: object; figures: object };
};

export interface BuilderProps {
  /** Saves the built case as a fault case of the project; throws an ApiError when the server refuses it. */
  create: (built: BuiltCase) => Promise<void>;
}

/** What a builder's `build` gives: the pulse to save and where it came from, or why there is none. */
export type BuildResult =
  | { ok: true; pulse: BuiltPulse; origin: { input: object; figures: object } }
  | { ok: false; reason: string };

/**
 * Saves what a builder made as a fault case named by the form: a builder's refusal and the server's answer land
 * on the form (the name field, or the form's own message).
 */
export async function saveBuilt<T extends FieldValues & { name: string }>(
  builder: string,
  name: string,
  result: BuildResult,
  create: BuilderProps["create"],
  setError: UseFormSetError<T>,
): Promise<void> {
  if (!result.ok) {
    setError("root.server", { message: result.reason });
    return;
  }
  try {
    await create({ name, ...result.pulse, origin: { builder, ...result.origin } });
  } catch (error) {
    applyServerErrors(error, setError, ["name" as Path<T>]);
  }
}

/** The pulse a builder will save, in words and figures. */
export function PulseSummary({ pulse }: { pulse: BuiltPulse }) {
  if (pulse.kind === "avalanche") {
    return (
      <p className="text-sm" data-testid="built-pulse">
        <span className="font-medium">{shapeWords.avalanche}</span>{" "}
        <span className="num">
          {q(pulse.current, "A")} cut through {q(pulse.inductance, "H")} from {q(pulse.supply, "V")}
        </span>
        ; each candidate is checked at its own breakdown voltage against its avalanche energy rating
      </p>
    );
  }
  if (pulse.kind === "waveform") {
    const { t } = pulse.samples;
    return (
      <p className="text-sm" data-testid="built-pulse">
        <span className="font-medium">fault sequence</span>{" "}
        <span className="num">
          {t.length} samples over {q(t[t.length - 1] - t[0], "s")}
        </span>
        , checked as one pulse
      </p>
    );
  }
  return (
    <p className="text-sm" data-testid="built-pulse">
      <span className="font-medium">{shapeWords[pulse.kind]}</span>{" "}
      <span className="num">
        {q(pulse.v, "V")} × {q(pulse.i, "A")}
        {pulse.kind === "triangle" ? " peak" : ""} for {q(pulse.duration, "s")}
      </span>
      , {repeatText(pulse.repeat) ?? "single pulse"}
    </p>
  );
}

/**
 * A builder's frame: its inputs at the left, the engine's intermediate figures live at the right with the pulse
 * it makes, and the name and the action to save it at the bottom right.
 */
export function BuilderLayout({
  title,
  description,
  fields,
  figures,
  reason,
  result,
  below,
  footer,
  error,
  pending,
  action = "Create fault case",
  onSubmit,
}: {
  title: string;
  description: ReactNode;
  fields: ReactNode;
  figures: object | null;
  reason: string | null;
  result: ReactNode;
  /** Drawn across the builder's width under its fields and figures (a chart, say). */
  below?: ReactNode;
  footer?: ReactNode;
  error?: string;
  pending: boolean;
  action?: string | null;
  onSubmit: () => void;
}) {
  return (
    <form
      aria-label={`${title} builder`}
      noValidate
      onSubmit={(event) => {
        event.preventDefault();
        onSubmit();
      }}
      className="rounded-md border border-line bg-panel p-4"
    >
      <p className="mb-4 max-w-3xl text-sm text-ink-muted">{description}</p>
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_21rem]">
        <div className="min-w-0 space-y-4">{fields}</div>
        <aside aria-label="Figures" className="rounded-md bg-sunken p-3" aria-live="polite">
          <h4 className="mb-2 text-xs font-semibold tracking-wide text-ink-muted uppercase">Figures</h4>
          {figures ? (
            <FigureList figures={figures} testId="builder-figures" />
          ) : (
            <p className="text-sm text-ink-muted">
              {reason ?? "Fill in the fields; the figures appear here."}
            </p>
          )}
          {result ? <div className="mt-3 border-t border-line pt-3">{result}</div> : null}
        </aside>
      </div>
      {below}
      <FormMessage tone="error">{error}</FormMessage>
      {footer || action ? (
        <div className="mt-4 flex flex-wrap items-end justify-between gap-3 border-t border-line pt-4">
          <div className="min-w-0 flex-1">{footer}</div>
          {action ? (
            <Button type="submit" variant="primary" pending={pending}>
              {action}
            </Button>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
