import type { ReactNode } from "react";
import { messageOf } from "./api-client";

/** A data table's status while its rows load through a query: what is loading, then the failure (role alert). */
export function queryStatus(
  query: { isPending: boolean; isError: boolean; error: unknown },
  loading: string,
): ReactNode {
  if (query.isPending) return loading;
  return query.isError ? (
    <span role="alert" className="text-fail">
      {messageOf(query.error)}
    </span>
  ) : null;
}
