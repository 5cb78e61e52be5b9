"use client";

import { useSyncExternalStore } from "react";

// The chart's colours come from the design tokens (src/app/globals.css), read once they exist in the browser, so
// the chart follows the light and dark themes and an exported SVG or PNG carries plain colour values.

export interface ChartColours {
  panel: string;
  ink: string;
  inkMuted: string;
  inkFaint: string;
  line: string;
  lineStrong: string;
  accent: string;
  accentStrong: string;
}

const tokens: Record<keyof ChartColours, string> = {
  panel: "--color-panel",
  ink: "--color-ink",
  inkMuted: "--color-ink-muted",
  inkFaint: "--color-ink-faint",
  line: "--color-line",
  lineStrong: "--color-line-strong",
  accent: "--color-accent",
  accentStrong: "--color-accent-strong",
};

/** The light theme's values: what the server renders and what a browser without the tokens falls back to. */
export const lightColours: ChartColours = {
  panel: "#ffffff",
  ink: "#23272b",
  inkMuted: "#5d656d",
  inkFaint: "#8b939a",
  line: "#dfe2e4",
  lineStrong: "#c5cacd",
  accent: "#0f5a73",
  accentStrong: "#0a4558",
};

let cached: { dark: boolean; colours: ChartColours } | null = null;

/** The tokens' values, read again only when the colour scheme changes (this runs on every render). */
function read(): ChartColours {
  const dark = window.matchMedia("(prefers-color-scheme: dark)").matches;
  if (cached?.dark === dark) return cached.colours;
  const style = getComputedStyle(document.documentElement);
  const colours = { ...lightColours };
  for (const [name, token] of Object.entries(tokens) as [keyof ChartColours, string][]) {
    const value = toHex(style.getPropertyValue(token).trim());
    if (value) colours[name] = value;
  }
  cached = { dark, colours };
  return colours;
}

function subscribe(onChange: () => void): () => void {
  const query = window.matchMedia("(prefers-color-scheme: dark)");
  query.addEventListener("change", onChange);
  return () => query.removeEventListener("change", onChange);
}

/** The token colours as #rrggbb, updated when the colour scheme changes. */
export function useChartColours(): ChartColours {
  return useSyncExternalStore(subscribe, read, () => lightColours);
}

let probe: CanvasRenderingContext2D | null = null;

/** Any CSS colour as #rrggbb, through the canvas's own parser; "" when it is not a colour. */
export function toHex(css: string): string {
  if (!css) return "";
  if (/^#[0-9a-f]{6}$/i.test(css)) return css.toLowerCase();
  probe ??= document.createElement("canvas").getContext("2d");
  if (!probe) return "";
  probe.fillStyle = "#000001";
  probe.fillStyle = css;
  const parsed = String(probe.fillStyle);
  return /^#[0-9a-f]{6}$/i.test(parsed) && !(parsed === "#000001" && css !== "#000001") ? parsed : "";
}

/** Mixes two #rrggbb colours: t = 0 gives `a`, t = 1 gives `b`. */
export function mix(a: string, b: string, t: number): string {
  const pa = channels(a);
  const pb = channels(b);
  const out = pa.map((c, k) => Math.round(c + (pb[k] - c) * t));
  return `#${out.map((c) => c.toString(16).padStart(2, "0")).join("")}`;
}

function channels(hex: string): number[] {
  return [1, 3, 5].map((k) => Number.parseInt(hex.slice(k, k + 2), 16));
}

/**
 * One hue family for n curves ordered by pulse width: the shortest in the strongest accent, each longer one
 * lighter (mixed toward the panel), so the order reads without a legend. Labels get a stronger variant.
 */
export function curveHues(colours: ChartColours, n: number): { line: string; text: string }[] {
  const span = 0.62;
  return Array.from({ length: n }, (_, k) => {
    const t = n <= 1 ? 0 : (k / (n - 1)) * span;
    return {
      line: mix(colours.accentStrong, colours.panel, t),
      text: mix(colours.accentStrong, colours.panel, t * 0.55),
    };
  });
}
