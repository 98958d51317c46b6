import { useState } from "react";
import { usePostMessage } from "./api/deviations.ts";
import { ProposalFields } from "./proposal-fields.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import type { DeviationDetail } from "../../../shared/deviations/views.ts";
import type { DeviationCondition, DeviationOutcome } from "../../../shared/deviations/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";

/** Writing a comment, a reply or a proposal; @handle mentions anyone taking part. */
export function MessageComposer({
  orgId,
  deviation,
  parentId,
  onDone,
}: {
  orgId: number;
  deviation: DeviationDetail;
  parentId?: number;
  onDone?: () => void;
}) {
  const post = usePostMessage(orgId, deviation.id);
  const [kind, setKind] = useState<"comment" | "proposal">("comment");
  const [body, setBody] = useState("");
  const [outcome, setOutcome] = useState<DeviationOutcome>("concession");
  const [conditions, setConditions] = useState<DeviationCondition[]>([]);
  const [quote, setQuote] = useState("");
  const id = `composer-${parentId ?? "new"}`;
  const submit = () =>
    post.mutate(
      {
        ...(kind === "proposal" ? { kind, proposal: { outcome, conditions } } : { kind }),
        parentId: parentId ?? null,
        body,
        quote: quote ? { analysisId: Number(quote.split(":")[0]), parameter: quote.split(":")[1]! } : null,
      } as Parameters<typeof post.mutate>[0],
      {
        onSuccess: () => {
          setBody("");
          setConditions([]);
          onDone?.();
        },
      },
    );
  return (
    <div className="flex flex-col gap-3 rounded-md border border-line bg-paper p-3">
      {post.isError && <Notice tone="error">{errorMessage(post.error)}</Notice>}
      <div className="grid gap-3 md:grid-cols-2">
        <SelectField
          label="Kind of message"
          id={`${id}-kind`}
          value={kind}
          onChange={(e) => setKind(e.target.value as typeof kind)}
          options={[
            { value: "comment", label: "Comment" },
            { value: "proposal", label: "Propose an outcome" },
          ]}
        />
        {deviation.analysisId !== null && deviation.verdicts.length > 0 && (
          <SelectField
            label="Quote a result"
            id={`${id}-quote`}
            value={quote}
            onChange={(e) => setQuote(e.target.value)}
            options={[
              { value: "", label: "No quote" },
              ...deviation.verdicts.map((v) => ({
                value: `${deviation.analysisId}:${v.parameter}`,
                label: `${findParameter(v.parameter)?.name}: ${v.resultText ?? "—"} (${v.outcome})`,
              })),
            ]}
          />
        )}
      </div>
      {kind === "proposal" && (
        <ProposalFields
          idPrefix={id}
          outcome={outcome}
          conditions={conditions}
          onChange={(o, c) => {
            setOutcome(o);
            setConditions(c);
          }}
        />
      )}
      <label htmlFor={`${id}-body`} className="text-sm font-semibold">
        {parentId ? "Reply" : "Message"}
      </label>
      <textarea
        id={`${id}-body`}
        rows={3}
        className="rounded-md border border-line bg-white px-2 py-1"
        value={body}
        onChange={(e) => setBody(e.target.value)}
        aria-describedby={`${id}-hint`}
      />
      <p id={`${id}-hint`} className="text-xs text-ink-500">
        Mention someone with @ and their handle:{" "}
        {deviation.participants
          .slice(0, 4)
          .map((p) => `@${p.handle}`)
          .join(", ")}
        …
      </p>
      <Button className="self-start" onClick={submit} disabled={post.isPending || !body.trim()}>
        {kind === "proposal" ? "Send the proposal" : parentId ? "Send the reply" : "Send"}
      </Button>
    </div>
  );
}
