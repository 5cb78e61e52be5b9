import type { Instrumentation } from "next";
import { noteRenderFailure } from "@/server/render-failures";

/** Runs once when the server starts. The Node.js-only work lives in its own module, out of the edge bundle. */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME === "nodejs") await import("./instrumentation-node");
}

/** A render that failed is not kept by the page memory (src/server/render-failures.ts). */
export const onRequestError: Instrumentation.onRequestError = (_error, request) => {
  noteRenderFailure(request.headers);
};
