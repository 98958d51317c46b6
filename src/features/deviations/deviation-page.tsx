import { useQuery, useQueryClient } from "@tanstack/react-query";
import { uploadFile } from "../../lib/upload.ts";
import { ConfirmButton, useConfirm } from "../../components/ui/confirm-dialog.tsx";
import { Link, useNavigate, useParams } from "react-router-dom";
import { useState } from "react";
import { useOrganisation } from "../../lib/signed-in.tsx";
import {
  attachmentUrl,
  deviationKeys,
  deviationPdfUrl,
  deviationQuery,
  useCloseDeviation,
  useDecide,
  useEditMessage,
  usePostMessage,
} from "./api/deviations.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";
import { VerdictTable } from "../../components/verdict-table.tsx";
import { HistoryPanel } from "../../components/history-panel.tsx";
import { MessageComposer } from "./message-composer.tsx";
import { ProposalFields } from "./proposal-fields.tsx";
import {
  CONDITION_LABELS,
  DEVIATION_OUTCOME_LABELS,
  DEVIATION_STATUS_LABELS,
  proposalText,
  type DeviationCondition,
  type DeviationOutcome,
} from "../../../shared/deviations/vocabulary.ts";
import type { DeviationDetail, MessageView } from "../../../shared/deviations/views.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { errorMessage } from "../../lib/api-client.ts";

export function DeviationPage() {
  const { orgId } = useOrganisation();
  const { deviationId } = useParams();
  const q = useQuery({ ...deviationQuery(orgId, Number(deviationId)) });
  if (q.isPending) return <LoadingState />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const d = q.data;
  return (
    <>
      <PageHeader
        title={`Deviation #${d.id}: lot ${d.lotCode}`}
        lead={
          <>
            {d.wineName}, vintage {d.vintage} ·{" "}
            {d.side === "laboratory" ? (
              `lot ${d.lotCode}`
            ) : (
              <Link className="underline" to={`/lots/${d.lotId}`}>
                lot page
              </Link>
            )}{" "}
            · {d.producerName} · {d.summary}
          </>
        }
        actions={
          <div className="flex items-center gap-2">
            <span className="rounded-full bg-must-50 px-3 py-1 text-sm font-semibold text-must-700">
              {DEVIATION_STATUS_LABELS[d.status]}
            </span>
            <a
              href={deviationPdfUrl(orgId, d.id)}
              className="rounded-md border border-line bg-card px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
              download
            >
              PDF record
            </a>
          </div>
        }
      />
      <div className="flex flex-col gap-6">
        {d.respondBy && d.status !== "decided" && d.status !== "closed" && (
          <Notice tone={d.overdue ? "error" : "info"}>
            {d.overdue ? "Overdue: a response was due by " : "Next response due by "}
            {d.respondBy.replace("T", " ").slice(0, 16)} UTC.
          </Notice>
        )}
        {d.verdicts.length > 0 && (
          <Card title="Results that opened it">
            <VerdictTable verdicts={d.verdicts} />
          </Card>
        )}
        {d.decision && (
          <Card title="Decision">
            <p className="font-semibold">{DEVIATION_OUTCOME_LABELS[d.decision.outcome]}</p>
            {d.decision.conditions.map((c, i) => (
              <p key={i} className="text-sm">
                {CONDITION_LABELS[c.kind]}: {c.detail}
              </p>
            ))}
            <p className="mt-2 text-sm">Reason: {d.decision.reason}</p>
            <p className="text-xs text-ink-500">
              Decided by {d.decidedBy} on {d.decidedAt?.slice(0, 10)}.
            </p>
            {d.decision.specVersionId && (
              <Link className="text-sm font-semibold text-must-700 underline" to={`/specs/${d.decision.specVersionId}`}>
                Open the draft specification this decision started
              </Link>
            )}
          </Card>
        )}
        <Card title="Discussion">
          <Thread orgId={orgId} d={d} parentId={null} depth={0} />
          {d.messages.length === 0 && <p className="mb-3 text-sm text-ink-500">No message yet.</p>}
          {d.actions.comment && (
            <div className="mt-4">
              <MessageComposer orgId={orgId} deviation={d} />
            </div>
          )}
        </Card>
        {d.actions.decide && <DecisionCard orgId={orgId} d={d} />}
        {d.actions.close && <CloseCard orgId={orgId} d={d} />}
        {d.side === "laboratory" ? (
          <Notice>
            The laboratory reads this deviation because its audit opened it; the buyer and the producer discuss and decide it.
          </Notice>
        ) : (
          <HistoryPanel orgId={orgId} entityType="deviation" entityId={d.id} />
        )}
      </div>
    </>
  );
}

function Thread({ orgId, d, parentId, depth }: { orgId: number; d: DeviationDetail; parentId: number | null; depth: number }) {
  const children = d.messages.filter(
    (m) => m.parentId === parentId || (parentId === null && m.parentId !== null && !d.messages.some((x) => x.id === m.parentId)),
  );
  if (!children.length) return null;
  return (
    <ul className={`flex flex-col gap-3 ${depth ? "ml-6 border-l-2 border-line pl-4" : ""}`}>
      {children.map((m) => (
        <li key={m.id}>
          <Message orgId={orgId} d={d} m={m} />
          <Thread orgId={orgId} d={d} parentId={m.id} depth={depth + 1} />
        </li>
      ))}
    </ul>
  );
}

function Message({ orgId, d, m }: { orgId: number; d: DeviationDetail; m: MessageView }) {
  const [replying, setReplying] = useState(false);
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(m.body);
  const [showHistory, setShowHistory] = useState(false);
  const edit = useEditMessage(orgId, d.id);
  const accept = usePostMessage(orgId, d.id);
  const confirm = useConfirm();
  const tone =
    m.kind === "decision" ? "border-must-700 bg-must-50" : m.side === "buyer" ? "border-line bg-card" : "border-verjus-700/30 bg-verjus-50";
  return (
    <article className={`rounded-md border px-3 py-2 text-sm ${tone}`} aria-label={`${m.kind} by ${m.author}`}>
      <p className="text-xs text-ink-500">
        {m.author}, {m.organisation} · {new Date(m.createdAt).toLocaleString("en-GB")} · <strong>{m.kind}</strong>
        {m.editedAt && (
          <button type="button" className="ml-2 underline" onClick={() => setShowHistory((v) => !v)}>
            edited ({m.edits.length})
          </button>
        )}
      </p>
      {m.proposal && (
        <p className="font-semibold">
          {DEVIATION_OUTCOME_LABELS[m.proposal.outcome]}
          {m.proposal.conditions.length > 0 &&
            ` — ${m.proposal.conditions.map((c) => `${CONDITION_LABELS[c.kind]}: ${c.detail}`).join("; ")}`}
        </p>
      )}
      {m.quote && (
        <blockquote className="my-1 border-l-4 border-ochre-700/40 pl-2 text-xs">
          {findParameter(m.quote.parameter)?.name}: {m.quote.resultText} ({m.quote.outcome})
        </blockquote>
      )}
      {editing ? (
        <div className="flex flex-col gap-2">
          <label className="sr-only" htmlFor={`edit-${m.id}`}>
            Edit your message
          </label>
          <textarea
            id={`edit-${m.id}`}
            className="rounded border border-line px-2 py-1"
            value={text}
            onChange={(e) => setText(e.target.value)}
          />
          <div className="flex gap-2">
            <Button onClick={() => edit.mutate({ messageId: m.id, body: text }, { onSuccess: () => setEditing(false) })}>Save</Button>
            <Button variant="quiet" onClick={() => setEditing(false)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : (
        <p className="whitespace-pre-wrap">{m.body}</p>
      )}
      {showHistory && (
        <ul className="mt-1 text-xs text-ink-500">
          {m.edits.map((e, i) => (
            <li key={i}>
              Before {e.editedAt.replace("T", " ").slice(0, 16)}: “{e.previousBody}”
            </li>
          ))}
        </ul>
      )}
      {m.attachments.map((a) => (
        <a key={a.id} href={attachmentUrl(orgId, a.id)} className="block text-xs font-semibold text-must-700 underline">
          {a.originalName} ({Math.max(1, Math.round(a.sizeBytes / 1024))} KB)
        </a>
      ))}
      {m.mine && d.actions.comment && <AttachFile orgId={orgId} deviationId={d.id} messageId={m.id} />}
      {accept.isError && <Notice tone="error">{errorMessage(accept.error)}</Notice>}
      <div className="mt-1 flex flex-wrap gap-3 text-xs font-semibold">
        {d.actions.comment && (
          <button type="button" className="text-must-700 underline" onClick={() => setReplying((v) => !v)}>
            Reply<span className="sr-only"> to {m.author}</span>
          </button>
        )}
        {m.mine && d.actions.comment && m.kind !== "decision" && (
          <button type="button" className="text-must-700 underline" onClick={() => setEditing(true)}>
            Edit
          </button>
        )}
        {m.kind === "proposal" && !m.mine && m.side !== d.side && d.actions.accept && (
          <button
            type="button"
            className="text-verjus-700 underline"
            onClick={() =>
              confirm.ask({
                title: `Accept ${m.author}'s proposal?`,
                consequence: (
                  <>
                    <p className="font-semibold">{m.proposal ? proposalText(m.proposal) : "The proposal"}.</p>
                    <p className="mt-2">
                      Both sides are then agreed; the discussion waits for the buyer's technologist to record the decision, and this
                      acceptance cannot be taken back.
                    </p>
                  </>
                ),
                confirmLabel: "Accept the proposal",
                onConfirm: () => accept.mutate({ kind: "acceptance", parentId: m.id, body: "Accepted." }),
              })
            }
          >
            Accept this proposal
          </button>
        )}
        {confirm.dialog}
      </div>
      {replying && (
        <div className="mt-2">
          <MessageComposer orgId={orgId} deviation={d} parentId={m.id} onDone={() => setReplying(false)} />
        </div>
      )}
    </article>
  );
}

function AttachFile({ orgId, deviationId, messageId }: { orgId: number; deviationId: number; messageId: number }) {
  const qc = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const id = `attach-${messageId}`;
  return (
    <div className="mt-1 text-xs">
      <label htmlFor={id} className="font-semibold">
        Attach a PDF or image
      </label>{" "}
      <input
        id={id}
        type="file"
        accept="application/pdf,image/png,image/jpeg"
        onChange={async (e) => {
          const file = e.target.files?.[0];
          if (!file) return;
          setError(null);
          try {
            await uploadFile(`/api/orgs/${orgId}/deviations/${deviationId}/messages/${messageId}/attachments`, file);
            await qc.invalidateQueries({ queryKey: deviationKeys.all(orgId) });
          } catch (err) {
            setError(errorMessage(err));
          } finally {
            e.target.value = "";
          }
        }}
      />
      {error && (
        <span role="alert" className="block font-semibold text-alarm-700">
          {error}
        </span>
      )}
    </div>
  );
}

function DecisionCard({ orgId, d }: { orgId: number; d: DeviationDetail }) {
  const navigate = useNavigate();
  const decide = useDecide(orgId, d.id);
  const lastProposal = [...d.messages].reverse().find((m) => m.proposal);
  const [outcome, setOutcome] = useState<DeviationOutcome>(lastProposal?.proposal?.outcome ?? "concession");
  const [conditions, setConditions] = useState<DeviationCondition[]>(lastProposal?.proposal?.conditions ?? []);
  const [reason, setReason] = useState("");
  return (
    <Card title="Decide">
      <p className="mb-3 text-sm text-ink-700">
        Only you, as the buyer's technologist, decide. The decision needs a reason and ends the discussion.
      </p>
      {decide.isError && <Notice tone="error">{errorMessage(decide.error)}</Notice>}
      <ProposalFields
        idPrefix="decision"
        outcome={outcome}
        conditions={conditions}
        onChange={(o, c) => {
          setOutcome(o);
          setConditions(c);
        }}
      />
      <label htmlFor="decision-reason" className="mt-3 block text-sm font-semibold">
        Reason
      </label>
      <textarea
        id="decision-reason"
        rows={3}
        className="w-full rounded-md border border-line px-2 py-1"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
      />
      <div className="mt-3">
        <ConfirmButton
          disabled={decide.isPending || reason.trim().length < 10}
          request={{
            title: `Record the decision on deviation #${d.id}?`,
            consequence: (
              <>
                <p className="font-semibold">{proposalText({ outcome, conditions })}.</p>
                <p className="mt-2">
                  The decision is final: it ends the discussion, both parties are notified, and lot {d.lotCode}'s status follows it.
                </p>
              </>
            ),
            confirmLabel: "Record the decision",
            onConfirm: () =>
              decide.mutate(
                { outcome, conditions, reason },
                { onSuccess: (r) => r.specVersionId && navigate(`/specs/${r.specVersionId}`) },
              ),
          }}
        >
          Record the decision
        </ConfirmButton>
      </div>
    </Card>
  );
}

function CloseCard({ orgId, d }: { orgId: number; d: DeviationDetail }) {
  const close = useCloseDeviation(orgId, d.id);
  return (
    <Card title="Close">
      <p className="mb-3 text-sm">Close the deviation once the decision's conditions are met.</p>
      {close.isError && <Notice tone="error">{errorMessage(close.error)}</Notice>}
      <Button variant="secondary" onClick={() => close.mutate()} disabled={close.isPending}>
        Close the deviation
      </Button>
    </Card>
  );
}
