/** Stating the wine's facts for the law; every judgement of the organisation may change with them. */
import { useMutation } from "@tanstack/react-query";
import { useRefreshOrganisation } from "../../../lib/refresh.ts";
import { api } from "../../../lib/api-client.ts";
import type { WineLawFacts } from "../../../../shared/specs/law-facts.ts";

export function useUpdateLawFacts(orgId: number, contractId: number) {
  const refresh = useRefreshOrganisation(orgId);
  return useMutation({
    mutationFn: (lawFacts: WineLawFacts) =>
      api<{ lawFacts: WineLawFacts }>(`/api/orgs/${orgId}/contracts/${contractId}/law-facts`, { method: "PUT", body: { lawFacts } }),
    onSuccess: refresh,
  });
}
