import "server-only";
import { dehydrate, HydrationBoundary, QueryClient, type QueryKey } from "@tanstack/react-query";
import type { ReactNode } from "react";

/**
 * Hands data a page loaded on the server to the client leaves below it, under the query keys their hooks use, so
 * they render with it at once and fetch nothing after hydration. Each answer goes through JSON first, as the route
 * handler's `json()` sends it: dates become ISO text and undefined fields drop, the shape the client types expect.
 */
export function Prefetched({ queries, children }: { queries: [QueryKey, unknown][]; children: ReactNode }) {
  const client = new QueryClient();
  for (const [key, data] of queries) client.setQueryData(key, JSON.parse(JSON.stringify(data)));
  return <HydrationBoundary state={dehydrate(client)}>{children}</HydrationBoundary>;
}
