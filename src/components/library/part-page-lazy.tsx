"use client";

import dynamic from "next/dynamic";
import type { ComponentProps } from "react";
import { AfterLoad } from "@/components/after-load";
import { LoadingBox } from "@/components/loading-box";

// The part page's sections below the SOA chart, loaded after the page: the upload (its dropzone), the thermal
// editor (its zod schema and Z_th chart) and the transfer editor (its CSV parser and chart) stay out of the first
// load. Each keeps a placeholder of about its height meanwhile.

const box = (what: string, height: string) => () => (
  <LoadingBox className={height}>Loading the {what}…</LoadingBox>
);

const CurveUpload = dynamic(() => import("./curve-upload").then((m) => m.CurveUpload), {
  ssr: false,
  loading: box("curve-set upload", "h-40"),
});
const ThermalEditor = dynamic(() => import("./thermal-editor").then((m) => m.ThermalEditor), {
  ssr: false,
  loading: box("thermal model", "h-64"),
});
const TransferEditor = dynamic(() => import("./transfer-editor").then((m) => m.TransferEditor), {
  ssr: false,
  loading: box("transfer characteristics", "h-64"),
});

export function LazyCurveUpload(props: ComponentProps<typeof CurveUpload>) {
  return (
    <AfterLoad fallback={box("curve-set upload", "h-40")()}>
      <CurveUpload {...props} />
    </AfterLoad>
  );
}

export function LazyThermalEditor(props: ComponentProps<typeof ThermalEditor>) {
  return (
    <AfterLoad fallback={box("thermal model", "h-64")()}>
      <ThermalEditor {...props} />
    </AfterLoad>
  );
}

export function LazyTransferEditor(props: ComponentProps<typeof TransferEditor>) {
  return (
    <AfterLoad fallback={box("transfer characteristics", "h-64")()}>
      <TransferEditor {...props} />
    </AfterLoad>
  );
}
