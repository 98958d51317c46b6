import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate, useParams } from "react-router-dom";
import { ConfirmButton } from "../../components/ui/confirm-dialog.tsx";
import { useState } from "react";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { specPdfUrl, useCreateVersion, useSpecAction } from "./api/specs.ts";
import { specQuery } from "../../lib/contracts.ts";
import type { SpecVersionDetail } from "../../../shared/specs/views.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";
import { StatusBadge } from "./status-badge.tsx";
import { LegalCaution } from "../../components/legal-caution.tsx";
import { HistoryPanel } from "../../components/history-panel.tsx";
import { SpecEditor } from "./spec-editor.tsx";
import { SpecReadView } from "./spec-read-view.tsx";
import { STAGE_LABELS } from "../../../shared/specs/vocabulary.ts";
import { errorMessage } from "../../lib/api-client.ts";

export function SpecPage() {
  const { orgId } = useOrganisation();
  const { specId } = useParams();
  const spec = useQuery({ ...specQuery(orgId, Number(specId)) });
  const [saved, setSaved] = useState(true);
  if (spec.isPending) return <LoadingState />;
  if (spec.isError) return <ErrorState error={spec.error} onRetry={() => spec.refetch()} />;
  const v = spec.data;
  return (
    <>
      <PageHeader
        title={`${v.contract.wine.name} · version ${v.number}`}
        lead={
          <>
            Contract{" "}
            <Link to={`/contracts/${v.contract.id}`} className="underline">
              {v.contract.reference}
            </Link>
            : {v.contract.retailer.name} buys from {v.contract.producer.name}. Vintages {v.vintageFrom}
            {v.vintageTo ? `–${v.vintageTo}` : " onwards"}; stages {v.stages.map((s) => STAGE_LABELS[s].toLowerCase()).join(", ")}.
          </>
        }
        actions={<StatusBadge status={v.status} />}
      />
      <div className="flex flex-col gap-6">
        <Actions orgId={orgId} version={v} saved={saved} />
        <LegalCaution />
        <Card title={v.actions.edit ? "Requirements (draft)" : "Requirements"}>
          {v.actions.edit ? <SpecEditor orgId={orgId} version={v} onSavedChange={setSaved} /> : <SpecReadView orgId={orgId} version={v} />}
        </Card>
        <HistoryPanel orgId={orgId} entityType="spec_version" entityId={v.id} />
      </div>
    </>
  );
}

function Actions({ orgId, version: v, saved }: { orgId: number; version: SpecVersionDetail; saved: boolean }) {
  const navigate = useNavigate();
  const send = useSpecAction(orgId, v.id, "send");
  const withdraw = useSpecAction(orgId, v.id, "withdraw");
  const agree = useSpecAction(orgId, v.id, "agree");
  const requestChanges = useSpecAction(orgId, v.id, "request-changes");
  const newVersion = useCreateVersion(orgId, v.contract.id);
  const [reason, setReason] = useState("");
  const [asking, setAsking] = useState(false);
  const failed = [send, withdraw, agree, requestChanges, newVersion].find((m) => m.isError);
  const compareWith = v.otherVersions.filter((o) => o.id !== v.id).at(-1);
  return (
    <div className="flex flex-col gap-3">
      {failed && <Notice tone="error">{errorMessage(failed.error)}</Notice>}
      {v.status === "with_producer" && v.side === "buyer" && (
        <Notice>Sent to {v.contract.producer.name}; it can no longer change. Make a new version to change it.</Notice>
      )}
      {v.status === "agreed" && (
        <Notice tone="success">Agreed by {v.contract.producer.name}: this version governs the lots of the vintages it covers.</Notice>
      )}
      <div className="flex flex-wrap gap-2">
        {v.actions.send && (
          <ConfirmButton
            disabled={!saved || send.isPending}
            request={{
              title: `Send version ${v.number} to ${v.contract.producer.name}?`,
              consequence:
                "The producer is notified and can agree to it or ask for changes. From now on this version cannot change; any change needs a new version.",
              confirmLabel: "Send to the producer",
              onConfirm: () => send.mutate(undefined),
            }}
          >
            Send to producer
          </ConfirmButton>
        )}
        {v.actions.decide && (
          <>
            <ConfirmButton
              disabled={agree.isPending}
              request={{
                title: `Agree to version ${v.number}?`,
                consequence: `It becomes binding: from now on it governs every lot of vintage ${v.vintageFrom}${v.vintageTo ? `–${v.vintageTo}` : " onwards"} under contract ${v.contract.reference}, and replaces any version agreed before.`,
                confirmLabel: "Agree to this version",
                onConfirm: () => agree.mutate(undefined),
              }}
            >
              Agree to this version
            </ConfirmButton>
            <Button variant="secondary" onClick={() => setAsking(true)}>
              Ask for changes
            </Button>
          </>
        )}
        {v.actions.newVersion && v.status !== "draft" && (
          <Button
            variant="secondary"
            disabled={newVersion.isPending}
            onClick={() => newVersion.mutate({ from: "version", versionId: v.id }, { onSuccess: ({ id }) => navigate(`/specs/${id}`) })}
          >
            New version from this one
          </Button>
        )}
        {compareWith && (
          <Link
            to={`/specs/${v.id}/compare?against=${compareWith.id}`}
            className="inline-flex items-center rounded-md border border-line bg-card px-4 py-2 text-sm font-semibold hover:bg-must-50"
          >
            Compare and backtest
          </Link>
        )}
        <a
          href={specPdfUrl(orgId, v.id)}
          className="inline-flex items-center rounded-md border border-line bg-card px-4 py-2 text-sm font-semibold hover:bg-must-50"
          download
        >
          Download PDF
        </a>
        {v.actions.withdraw && (
          <ConfirmButton
            variant="danger"
            disabled={withdraw.isPending}
            request={{
              title: `Withdraw version ${v.number}?`,
              consequence: "It will no longer govern any lot. Lots already judged against it keep their verdicts.",
              confirmLabel: "Withdraw this version",
              tone: "danger",
              onConfirm: () => withdraw.mutate(undefined),
            }}
          >
            Withdraw
          </ConfirmButton>
        )}
      </div>
      {asking && (
        <form
          className="flex flex-col gap-2 rounded-card border border-line bg-card p-4"
          onSubmit={(e) => {
            e.preventDefault();
            requestChanges.mutate({ reason }, { onSuccess: () => setAsking(false) });
          }}
        >
          <label htmlFor="change-reason" className="text-sm font-semibold">
            What should change?
          </label>
          <textarea
            id="change-reason"
            rows={3}
            className="rounded-md border border-line px-2 py-1"
            value={reason}
            onChange={(e) => setReason(e.target.value)}
          />
          <div className="flex gap-2">
            <Button type="submit" disabled={requestChanges.isPending || reason.trim().length < 3}>
              Send back to the buyer
            </Button>
            <Button variant="quiet" onClick={() => setAsking(false)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
    </div>
  );
}
