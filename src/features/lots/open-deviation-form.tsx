import { useMutation } from "@tanstack/react-query";
import { useRefreshOrganisation } from "../../lib/refresh.ts";
import { useNavigate } from "react-router-dom";
import { useState } from "react";
import { api, errorMessage } from "../../lib/api-client.ts";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { findParameter } from "../../../shared/engine/index.ts";

/** Opening a deviation by hand (a tasting fault, a label problem), with the reason written down. */
export function OpenDeviationForm({ orgId, lotId, parameters }: { orgId: number; lotId: number; parameters: string[] }) {
  const navigate = useNavigate();
  const refresh = useRefreshOrganisation(orgId);
  const [reason, setReason] = useState("");
  const [chosen, setChosen] = useState<string[]>([]);
  const open = useMutation({
    mutationFn: () => api<{ id: number }>(`/api/orgs/${orgId}/deviations`, { method: "POST", body: { lotId, parameters: chosen, reason } }),
    onSuccess: ({ id }) => {
      void refresh();
      navigate(`/deviations/${id}`);
    },
  });
  return (
    <div className="flex flex-col gap-3 text-sm">
      {open.isError && <Notice tone="error">{errorMessage(open.error)}</Notice>}
      <fieldset className="flex flex-wrap gap-3">
        <legend className="mb-1 font-semibold">Parameters concerned (optional)</legend>
        {parameters.map((p) => (
          <label key={p} className="flex items-center gap-1">
            <input
              type="checkbox"
              checked={chosen.includes(p)}
              onChange={(e) => setChosen(e.target.checked ? [...chosen, p] : chosen.filter((x) => x !== p))}
            />{" "}
            {findParameter(p)?.name ?? p}
          </label>
        ))}
      </fieldset>
      <label htmlFor={`manual-reason-${lotId}`} className="font-semibold">
        Why
      </label>
      <textarea
        id={`manual-reason-${lotId}`}
        rows={3}
        className="rounded-md border border-line px-2 py-1"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
      />
      <Button className="self-start" disabled={open.isPending || reason.trim().length < 10} onClick={() => open.mutate()}>
        Open the deviation
      </Button>
    </div>
  );
}
