import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api, errorMessage } from "../../lib/api-client.ts";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import type { ContractDetail } from "../../../shared/specs/views.ts";

/** While the producer has not accepted the contract: who must act, and the producer admin's button. */
export function ContractAcceptance({ orgId, contract }: { orgId: number; contract: ContractDetail }) {
  const queryClient = useQueryClient();
  const accept = useMutation({
    mutationFn: () => api(`/api/orgs/${orgId}/contracts/${contract.id}/accept`, { method: "POST" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["orgs", orgId] }),
  });
  if (contract.producerAcceptedAt) return null;
  if (contract.side === "buyer")
    return (
      <Notice tone="info">
        Waiting for {contract.producer.name} to accept this contract. You can draft spec versions now; they reach the producer once its
        admin accepts.
      </Notice>
    );
  return (
    <Notice tone="info">
      <p>
        {contract.retailer.name} names {contract.producer.name} as the producer of {contract.wine.name}. No specification reaches you until
        your organisation&apos;s admin accepts the contract.
      </p>
      {contract.canAccept && (
        <div className="mt-3">
          <Button onClick={() => accept.mutate()} disabled={accept.isPending}>
            {accept.isPending ? "Accepting…" : "Accept the contract"}
          </Button>
        </div>
      )}
      {accept.isError && <p className="mt-2 text-alarm-700">{errorMessage(accept.error)}</p>}
    </Notice>
  );
}
