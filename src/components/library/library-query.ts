import type { ReadonlyURLSearchParams } from "next/navigation";
import { type PartSortKey, partSortKeys } from "@/lib/library/part-sort";
import type { technologies } from "@/lib/library/technologies";

// The library list's state lives in the URL: these are its keys, their defaults, and the query the list sends.

export type Technology = (typeof technologies)[number];

export const sortKeys = partSortKeys;
export type SortKey = PartSortKey;

export const PAGE_SIZE = 50;

export interface LibraryState {
  q: string;
  technology: Technology[];
  package: string;
  maker: string;
  vdsMin: string;
  vdsMax: string;
  status: "" | "draft" | "verified";
  archived: boolean;
  sort: SortKey;
  dir: "asc" | "desc";
  page: number;
}

export function readState(params: URLSearchParams | ReadonlyURLSearchParams): LibraryState {
  const sort = params.get("sort");
  const status = params.get("status");
  const page = Number(params.get("page"));
  return {
    q: params.get("q") ?? "",
    technology: (params.get("technology") ?? "").split(",").filter(Boolean) as Technology[],
    package: params.get("package") ?? "",
    maker: params.get("maker") ?? "",
    vdsMin: params.get("vdsMin") ?? "",
    vdsMax: params.get("vdsMax") ?? "",
    status: status === "draft" || status === "verified" ? status : "",
    archived: params.get("archived") === "true",
    sort: sortKeys.includes(sort as SortKey) ? (sort as SortKey) : "partNumber",
    dir: params.get("dir") === "desc" ? "desc" : "asc",
    page: Number.isInteger(page) && page > 1 ? page : 1,
  };
}

/** The state as URL parameters, defaults left out so that a plain /library stays plain. */
export function writeState(state: LibraryState): URLSearchParams {
  const out = new URLSearchParams();
  if (state.q) out.set("q", state.q);
  if (state.technology.length) out.set("technology", state.technology.join(","));
  if (state.package) out.set("package", state.package);
  if (state.maker) out.set("maker", state.maker);
  if (state.vdsMin) out.set("vdsMin", state.vdsMin);
  if (state.vdsMax) out.set("vdsMax", state.vdsMax);
  if (state.status) out.set("status", state.status);
  if (state.archived) out.set("archived", "true");
  if (state.sort !== "partNumber") out.set("sort", state.sort);
  if (state.dir !== "asc") out.set("dir", state.dir);
  if (state.page > 1) out.set("page", String(state.page));
  return out;
}

/** The query string for GET /api/parts. */
export function apiQuery(state: LibraryState): string {
  const out = writeState(state);
  out.set("sort", state.sort);
  out.set("dir", state.dir);
  out.set("pageSize", String(PAGE_SIZE));
  return out.toString();
}

export function hasFilters(state: LibraryState): boolean {
  return Boolean(
    state.q ||
      state.technology.length ||
      state.package ||
      state.maker ||
      state.vdsMin ||
      state.vdsMax ||
      state.status ||
      state.archived,
  );
}

export interface PartRow {
  id: string;
  partNumber: string;
  maker: string;
  technology: Technology;
  package: string;
  vdsMax: number;
  idMax: number | null;
  rdsOn: number | null;
  tjMax: number;
  status: "draft" | "verified";
  unitCost: number | null;
  currency: string | null;
  hasThermalModel: boolean;
  updatedAt: string;
  archivedAt: string | null;
}

export interface PartPage {
  rows: PartRow[];
  total: number;
  page: number;
  pageSize: number;
  facets: { makers: string[]; packages: string[] };
}
