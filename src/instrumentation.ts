/** Runs once when the server starts. The Node.js-only work lives in its own module, out of the edge bundle. */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME === "nodejs") await import("./instrumentation-node");
}
