/** A sent or agreed version, read-only, with the comments on each row and a form to add one. */
import { useState } from "react";
import { findParameter, ruleLabel, UNITS } from "../../../shared/engine/index.ts";
import { SEVERITY_LABELS, STAGE_LABELS } from "../../../shared/specs/vocabulary.ts";
import { wineProfile } from "../../../shared/specs/profile.ts";
import { useAddComment } from "./api/specs.ts";
import type { RequirementView, SpecCommentView, SpecVersionDetail } from "../../../shared/specs/views.ts";
import { LegalCheck } from "./legal-check.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const num = (x: number | null) => (x === null ? null : String(Number(x.toPrecision(6))));

function limits(r: RequirementView): string {
  const u = UNITS[r.unit]?.label ?? r.unit;
  const lo = num(r.lower);
  const hi = num(r.upper);
  const range = lo && hi ? `${lo} – ${hi}` : hi ? `at most ${hi}` : lo ? `at least ${lo}` : "must be absent";
  return `${range}${r.target !== null ? ` (target ${num(r.target)})` : ""} ${r.unit === "presence" ? "" : u}`;
}

export function SpecReadView({ orgId, version }: { orgId: number; version: SpecVersionDetail }) {
  const profile = wineProfile(version.contract.wine, version.vintageFrom);
  const general = version.comments.filter((c) => c.requirementId === null);
  return (
    <div className="flex flex-col gap-4">
      <DataTable headings={["Parameter", "Limits", "Method and rule", "Law in " + version.contract.wine.markets.join(", "), "Comments"]}>
        {version.requirements.map((r) => (
          <Row key={r.id}>
            <Cell>
              <span className="font-semibold">{findParameter(r.parameter)?.name ?? r.parameter}</span>
              <span className="block text-xs text-ink-500">{SEVERITY_LABELS[r.severity]}</span>
              <span className="block text-xs text-ink-500">{r.stages.map((s) => STAGE_LABELS[s]).join(", ")}</span>
            </Cell>
            <Cell className="tabular-nums">{limits(r)}</Cell>
            <Cell>
              {r.method ?? "—"}
              <span className="block text-xs text-ink-500">{ruleLabel(r.rule)}</span>
            </Cell>
            <Cell className="w-72">
              <LegalCheck row={r} markets={version.contract.wine.markets} profile={profile} />
            </Cell>
            <Cell className="w-80">
              <Thread orgId={orgId} version={version} requirement={r} comments={version.comments.filter((c) => c.requirementId === r.id)} />
            </Cell>
          </Row>
        ))}
      </DataTable>
      <section aria-label="General comments" className="rounded-card border border-line bg-card p-4">
        <h3 className="mb-2 font-semibold">Comments on the whole version</h3>
        <Thread orgId={orgId} version={version} comments={general} />
      </section>
    </div>
  );
}

function Thread({
  orgId,
  version,
  requirement,
  comments,
}: {
  orgId: number;
  version: SpecVersionDetail;
  requirement?: RequirementView;
  comments: SpecCommentView[];
}) {
  const add = useAddComment(orgId, version.id);
  const [body, setBody] = useState("");
  const [open, setOpen] = useState(false);
  const label = requirement
    ? `Comment on ${findParameter(requirement.parameter)?.name ?? requirement.parameter}`
    : "Comment on the version";
  return (
    <div className="flex flex-col gap-2 text-sm">
      {comments.map((c) => (
        <div key={c.id} className={`rounded-md px-3 py-2 ${c.side === "buyer" ? "bg-must-50" : "bg-verjus-50"}`}>
          <p className="text-xs text-ink-500">
            {c.author}, {c.organisation} · {new Date(c.createdAt).toLocaleString("en-GB")}
          </p>
          <p className="whitespace-pre-wrap">{c.body}</p>
        </div>
      ))}
      {version.actions.comment &&
        (open ? (
          <form
            onSubmit={(e) => {
              e.preventDefault();
              add.mutate(
                { requirementId: requirement?.id ?? null, body },
                {
                  onSuccess: () => {
                    setBody("");
                    setOpen(false);
                  },
                },
              );
            }}
            className="flex flex-col gap-2"
          >
            <label className="sr-only" htmlFor={`comment-${requirement?.id ?? "version"}`}>
              {label}
            </label>
            <textarea
              id={`comment-${requirement?.id ?? "version"}`}
              className="rounded-md border border-line px-2 py-1"
              rows={3}
              value={body}
              onChange={(e) => setBody(e.target.value)}
            />
            {add.isError && <Notice tone="error">{errorMessage(add.error)}</Notice>}
            <div className="flex gap-2">
              <Button type="submit" disabled={add.isPending || !body.trim()}>
                Post comment
              </Button>
              <Button variant="quiet" onClick={() => setOpen(false)}>
                Cancel
              </Button>
            </div>
          </form>
        ) : (
          <button type="button" className="self-start text-sm font-semibold text-must-700 underline" onClick={() => setOpen(true)}>
            Add a comment<span className="sr-only"> {label.replace(/^Comment /, "")}</span>
          </button>
        ))}
    </div>
  );
}
