// Response times and outcomes of one load run, summarised as printed figures (never asserted).

export interface Figures {
  title: string;
  requests: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  /** Answers by HTTP status ("none": the connection ended without a status line). */
  statuses: Record<string, number>;
  timeouts: number;
  errors: number;
}

/** The q-quantile (0..1) of sorted values, nearest rank; NaN when there are none. */
export function quantile(sorted: readonly number[], q: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[rank];
}

export class Recorder {
  private readonly times: number[] = [];
  private readonly statuses: Record<string, number> = {};

  response(status: number | undefined, ms: number): void {
    this.times.push(ms);
    const key = status === undefined ? "none" : String(status);
    this.statuses[key] = (this.statuses[key] ?? 0) + 1;
  }

  figures(title: string, seconds: number, timeouts: number, otherErrors: number): Figures {
    const sorted = this.times.slice().sort((a, b) => a - b);
    return {
      title,
      requests: sorted.length,
      perSecond: sorted.length / seconds,
      p50: quantile(sorted, 0.5),
      p95: quantile(sorted, 0.95),
      p99: quantile(sorted, 0.99),
      max: sorted.at(-1) ?? Number.NaN,
      statuses: this.statuses,
      timeouts,
      errors: Math.max(otherErrors, 0),
    };
  }
}

export function figuresLine(f: Figures): string {
  const ms = (x: number) => (Number.isNaN(x) ? "–" : `${x.toFixed(x < 10 ? 1 : 0)} ms`);
  const statuses = Object.entries(f.statuses)
    .map(([status, n]) => `${status}×${n}`)
    .join(" ");
  return (
    `${f.title.padEnd(24)} ${f.perSecond.toFixed(0).padStart(5)} req/s  p50 ${ms(f.p50)}  p95 ${ms(f.p95)}  ` +
    `p99 ${ms(f.p99)}  max ${ms(f.max)}  [${statuses || "no answers"}]  timeouts ${f.timeouts}  errors ${f.errors}`
  );
}
