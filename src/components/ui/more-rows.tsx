/** Under a paged list: how many rows are shown of how many, and a button that loads the next page. */
import { Button } from "./button.tsx";
import type { Page } from "../../../shared/paging.ts";

interface PagedQuery {
  data?: { pages: Page<unknown>[] };
  hasNextPage: boolean;
  isFetchingNextPage: boolean;
  fetchNextPage: () => unknown;
}

export function MoreRows({ query, noun = "rows" }: { query: PagedQuery; noun?: string }) {
  const pages = query.data?.pages ?? [];
  if (!pages.length) return null;
  const shown = pages.reduce((n, p) => n + p.items.length, 0);
  const total = pages[0]!.total;
  return (
    <div className="mt-4 flex items-center gap-4 text-sm text-ink-500">
      <span role="status">
        {shown.toLocaleString("en-GB")} of {total.toLocaleString("en-GB")} {noun}
      </span>
      {query.hasNextPage && (
        <Button variant="secondary" disabled={query.isFetchingNextPage} onClick={() => void query.fetchNextPage()}>
          {query.isFetchingNextPage ? "Loading…" : "Show more"}
        </Button>
      )}
    </div>
  );
}
