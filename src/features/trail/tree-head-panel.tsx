import { useMutation } from "@tanstack/react-query";
import { api, errorMessage } from "../../lib/api-client.ts";
import { Button } from "../../components/ui/button.tsx";
import { FileField } from "../../components/ui/field.tsx";
import { Notice } from "../../components/ui/states.tsx";
import type { KeptHeadCheck, SignedTreeHead } from "../../../shared/trail/views.ts";

/** Takes a signed head of the trail for the organisation to keep, and offers it as a file. */
export function TreeHeadPanel({ orgId }: { orgId: number }) {
  const head = useMutation({ mutationFn: () => api<SignedTreeHead>(`/api/orgs/${orgId}/trail/tree-head`) });
  const check = useMutation({
    mutationFn: async (file: File) => {
      let kept: unknown;
      try {
        kept = JSON.parse(await file.text());
      } catch {
        throw new Error(`${file.name} is not a signed head: it is not JSON.`);
      }
      return api<KeptHeadCheck>(`/api/orgs/${orgId}/trail/check-head`, { method: "POST", body: kept });
    },
  });
  const download = (h: SignedTreeHead) => {
    const url = URL.createObjectURL(new Blob([JSON.stringify(h, null, 2)], { type: "application/json" }));
    const a = Object.assign(document.createElement("a"), { href: url, download: `trail-head-${h.treeSize}.json` });
    a.click();
    URL.revokeObjectURL(url);
  };
  return (
    <section aria-labelledby="tree-head" className="mt-6 border-t border-line pt-4">
      <h2 id="tree-head" className="text-lg font-semibold">
        Signed tree head
      </h2>
      <p className="mt-1 max-w-prose text-sm text-ink-500">
        A signed statement of the trail's size and Merkle root now. Keep it: with it your organisation can later prove that no entry before
        it was changed or removed. Your admins also receive one by mail each day.
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Button variant="secondary" onClick={() => head.mutate()} disabled={head.isPending}>
          {head.isPending ? "Signing…" : "Take a signed head"}
        </Button>
        {head.data && (
          <Button variant="secondary" onClick={() => download(head.data)}>
            Download it
          </Button>
        )}
      </div>
      <div className="mt-4">
        <FileField label="Check a head you kept" accept="application/json,.json" onFile={(file) => check.mutate(file)} />
        <div className="mt-2">
          {check.data?.consistent && (
            <Notice tone="success">
              The head you kept is Cellarpact&apos;s, and the trail today ({check.data.currentSize} entries) extends its{" "}
              {check.data.keptSize} entries unchanged.
            </Notice>
          )}
          {check.data && !check.data.consistent && <Notice tone="error">{check.data.reason}</Notice>}
          {check.isError && <Notice tone="error">{errorMessage(check.error)}</Notice>}
        </div>
      </div>
      {head.data && (
        <div role="status">
          <dl className="mt-3 grid max-w-3xl grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-ink-500">Entries</dt>
            <dd>{head.data.treeSize}</dd>
            <dt className="text-ink-500">Signed at</dt>
            <dd>{new Date(head.data.timestamp).toLocaleString("en-GB", { timeZone: "UTC" })} UTC</dd>
            <dt className="text-ink-500">Merkle root</dt>
            <dd className="break-all font-mono text-xs">{head.data.rootHash}</dd>
            <dt className="text-ink-500">Key</dt>
            <dd className="break-all font-mono text-xs">Ed25519 {head.data.keyId.slice(0, 16)}…</dd>
          </dl>
        </div>
      )}
    </section>
  );
}
