/** Loading, empty and error states, so every list and page says what is going on. */
import type { ReactNode } from "react";
import type { UseQueryResult } from "@tanstack/react-query";
import { errorMessage } from "../../lib/api-client.ts";

export function LoadingState({ label = "Loading…" }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-8 text-ink-500">
      <span className="size-4 animate-spin rounded-full border-2 border-must-600 border-t-transparent" aria-hidden />
      {label}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-card border border-dashed border-line bg-card px-6 py-8 text-center">
      <p className="font-semibold text-ink-900">{title}</p>
      {children && <div className="mt-1 text-sm text-ink-500">{children}</div>}
    </div>
  );
}

export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  return (
    <div role="alert" className="rounded-card border border-alarm-700/30 bg-alarm-50 px-4 py-3 text-alarm-700">
      <p className="font-semibold">This could not be loaded.</p>
      <p className="text-sm">{errorMessage(error)}</p>
      {onRetry && (
        <button type="button" onClick={onRetry} className="mt-2 text-sm font-semibold underline">
          Try again
        </button>
      )}
    </div>
  );
}

export function Notice({ tone = "info", children }: { tone?: "info" | "success" | "error"; children: ReactNode }) {
  const cls = {
    info: "border-line bg-card text-ink-700",
    success: "border-verjus-700/30 bg-verjus-50 text-verjus-700",
    error: "border-alarm-700/30 bg-alarm-50 text-alarm-700",
  }[tone];
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-md border px-4 py-3 text-sm ${cls}`}>
      {children}
    </div>
  );
}

/** What a query shows before its data: a spinner, the error with a retry, or `empty` when a list came back empty. */
export function QueryStatus({
  query,
  empty,
}: {
  query: Pick<UseQueryResult<unknown>, "isPending" | "isError" | "error" | "refetch" | "data">;
  empty?: string;
}) {
  if (query.isPending) return <LoadingState />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  if (empty !== undefined && isEmpty(query.data)) return <EmptyState title={empty} />;
  return null;
}

/** An empty list, whether it came whole or as pages. */
function isEmpty(data: unknown): boolean {
  if (Array.isArray(data)) return data.length === 0;
  const pages = (data as { pages?: { items: unknown[] }[] } | undefined)?.pages;
  return !!pages && pages.every((p) => p.items.length === 0);
}
