/** The recorded history of one entity, with the hash chain's verification on demand. */
import { useMutation, useQuery } from "@tanstack/react-query";
import type { HistoryEntityType } from "../../shared/trail/history.ts";
import { historyQuery, verifyChain } from "../lib/trail.ts";
import { Card } from "./ui/page.tsx";
import { ErrorState, LoadingState, Notice } from "./ui/states.tsx";
import { Button } from "./ui/button.tsx";
import { actionLabel } from "../../shared/trail/vocabulary.ts";

export function HistoryPanel({ orgId, entityType, entityId }: { orgId: number; entityType: HistoryEntityType; entityId: number }) {
  const history = useQuery(historyQuery(orgId, entityType, entityId));
  const verify = useMutation({ mutationFn: () => verifyChain(orgId) });
  return (
    <Card title="Trail">
      {history.isPending && <LoadingState />}
      {history.isError && <ErrorState error={history.error} />}
      {history.data && (
        <ol className="mb-3 flex flex-col gap-1 text-sm" aria-label="Recorded events">
          {history.data.map((e) => (
            <li key={e.seq} className="flex flex-wrap gap-x-3">
              <span className="tabular-nums text-ink-500">
                #{e.seq} · {e.occurredAt.replace("T", " ").slice(0, 19)} UTC
              </span>
              <span className="font-semibold">{actionLabel(e.action)}</span>
              <span>{e.actorName ?? "system"}</span>
              <span className="font-mono text-xs text-ink-500">{e.hash.slice(0, 12)}…</span>
            </li>
          ))}
        </ol>
      )}
      <Button variant="secondary" onClick={() => verify.mutate()} disabled={verify.isPending}>
        {verify.isPending ? "Verifying…" : "Verify the hash chain"}
      </Button>
      {verify.data?.ok && (
        <div className="mt-2">
          <Notice tone="success">
            The chain is intact: all {verify.data.checked} entries about your organisation recomputed and linked into the chain.
          </Notice>
        </div>
      )}
      {verify.data && !verify.data.ok && (
        <div className="mt-2">
          <Notice tone="error">
            The chain is broken at entry {verify.data.firstBroken?.seq}: {verify.data.firstBroken?.reason}.
          </Notice>
        </div>
      )}
      {verify.isError && <ErrorState error={verify.error} />}
    </Card>
  );
}
