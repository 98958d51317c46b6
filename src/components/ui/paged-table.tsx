/** A paged list as a table: its loading, error and empty states, the rows loaded so far, and "Show more". */
import type { ReactNode } from "react";
import type { InfiniteData, UseInfiniteQueryResult } from "@tanstack/react-query";
import { DataTable } from "./table.tsx";
import { MoreRows } from "./more-rows.tsx";
import { QueryStatus } from "./states.tsx";
import { rowsOf } from "../../lib/paged.ts";
import type { Page } from "../../../shared/paging.ts";

interface Props<T> {
  query: UseInfiniteQueryResult<InfiniteData<Page<T>>>;
  headings: ReactNode[];
  /** What the empty list says. */
  empty: string;
  /** What the rows are, for "N of M lots". */
  noun: string;
  children: (rows: T[]) => ReactNode;
}

export function PagedTable<T>({ query, headings, empty, noun, children }: Props<T>) {
  const rows = rowsOf(query.data);
  if (query.isPending || query.isError || rows.length === 0) return <QueryStatus query={query} empty={empty} />;
  return (
    <>
      <DataTable headings={headings}>{children(rows)}</DataTable>
      <MoreRows query={query} noun={noun} />
    </>
  );
}
