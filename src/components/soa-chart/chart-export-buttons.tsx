"use client";

import { type RefObject, useState } from "react";
import { Button, InlineAlert } from "@/components/form";
import { downloadPng, downloadSvg } from "./chart-export";

/** "SVG" and "PNG": the chart as drawn, with its legend, for reports. */
export function ChartExport({ frame, fileName }: { frame: RefObject<HTMLElement | null>; fileName: string }) {
  const [error, setError] = useState<string | null>(null);
  const safeName = fileName.replace(/[^\w.-]+/g, "_");
  const svg = () => frame.current?.querySelector("svg") ?? null;
  return (
    <div className="flex items-center gap-2">
      <span className="text-xs text-ink-muted">Export</span>
      <Button
        size="sm"
        onClick={() => {
          const element = svg();
          if (element) downloadSvg(element, safeName);
        }}
      >
        SVG
      </Button>
      <Button
        size="sm"
        onClick={async () => {
          const element = svg();
          if (!element) return;
          setError(null);
          try {
            await downloadPng(element, safeName);
          } catch (e) {
            setError(e instanceof Error ? e.message : "The PNG could not be made.");
          }
        }}
      >
        PNG
      </Button>
      <InlineAlert>{error}</InlineAlert>
    </div>
  );
}
