"use client";

import dynamic from "next/dynamic";
import type { ComponentProps } from "react";
import { AfterLoad } from "@/components/after-load";
import { LoadingBox } from "@/components/loading-box";

// The token list sits at the foot of the account page: its table (and the table library with it) loads after the
// page is drawn, so the account page's first load stays within its budget. A placeholder holds its place meanwhile.

const placeholder = () => <LoadingBox className="h-24">Loading your API tokens…</LoadingBox>;

const TokensTable = dynamic(() => import("./tokens-table").then((m) => m.TokensTable), {
  ssr: false,
  loading: placeholder,
});

export function LazyTokensTable(props: ComponentProps<typeof TokensTable>) {
  return (
    <AfterLoad fallback={placeholder()}>
      <TokensTable {...props} />
    </AfterLoad>
  );
}
