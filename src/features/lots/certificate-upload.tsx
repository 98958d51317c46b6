import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { lotKeys, uploadCertificate } from "./api/lots.ts";
import { Notice } from "../../components/ui/states.tsx";
import { errorMessage } from "../../lib/api-client.ts";

export function CertificateUpload({ orgId, analysisId, label = "Attach the laboratory's certificate" }: { orgId: number; analysisId: number; label?: string }) {
  const qc = useQueryClient();
  const [state, setState] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const id = `certificate-${analysisId}`;
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={id} className="font-semibold">{label} (PDF, PNG or JPEG, at most 10 MB)</label>
      <input
        id={id}
        type="file"
        accept="application/pdf,image/png,image/jpeg"
        disabled={busy}
        onChange={async (e) => {
          const file = e.target.files?.[0];
          if (!file) return;
          setBusy(true);
          setState(null);
          try {
            const r = await uploadCertificate(orgId, analysisId, file);
            setState({ tone: "success", text: `Attached. SHA-256 ${r.sha256.slice(0, 16)}… is on the trail.` });
            await qc.invalidateQueries({ queryKey: lotKeys.all(orgId) });
          } catch (err) {
            setState({ tone: "error", text: errorMessage(err) });
          } finally {
            setBusy(false);
            e.target.value = "";
          }
        }}
      />
      {state && <Notice tone={state.tone}>{state.text}</Notice>}
    </div>
  );
}
