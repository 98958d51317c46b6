import { useState } from "react";
import { uploadCertificate } from "../lib/documents.ts";
import { Notice } from "./ui/states.tsx";
import { errorMessage } from "../lib/api-client.ts";

/** Attaches a signed certificate or report to an analysis; the page says what to refresh afterwards. */
export function CertificateUpload({
  orgId,
  analysisId,
  label = "Attach the laboratory's certificate",
  onUploaded,
}: {
  orgId: number;
  analysisId: number;
  label?: string;
  onUploaded: () => Promise<unknown>;
}) {
  const [state, setState] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const id = `certificate-${analysisId}`;
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={id} className="font-semibold">
        {label} (PDF, PNG or JPEG, at most 10 MB)
      </label>
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
            await onUploaded();
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
