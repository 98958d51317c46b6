/** Lists the server answers a page at a time (see shared/paging.ts), read with TanStack Query's infinite queries. */
import { infiniteQueryOptions, type QueryKey } from "@tanstack/react-query";
import { api } from "./api-client.ts";
import type { Page } from "../../shared/paging.ts";

/** The query string of a list's filters, leaving out the empty ones. */
export function queryString(filters: Record<string, string | number | undefined>): string {
  const qs = new URLSearchParams(
    Object.entries(filters)
      .filter(([, v]) => v !== undefined && v !== "")
      .map(([k, v]) => [k, String(v)]),
  );
  return qs.size ? `?${qs}` : "";
}

/** A list read page after page: `path` without paging, `filters` its own query. */
export function pagedQuery<T>(queryKey: QueryKey, path: string, filters: Record<string, string | number | undefined> = {}) {
  return infiniteQueryOptions({
    queryKey,
    queryFn: ({ pageParam }) => api<Page<T>>(`${path}${queryString({ ...filters, cursor: pageParam })}`),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });
}

/** Every row loaded so far, in order. */
export const rowsOf = <T>(data: { pages: Page<T>[] } | undefined): T[] => data?.pages.flatMap((p) => p.items) ?? [];
