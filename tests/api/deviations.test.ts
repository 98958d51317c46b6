import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, ORG, signInAs, type SignedInAgent, type TestApp, CONTRACT } from "../support/api.ts";
import { startTestMail } from "../support/mail.ts";
import { party, plannedLot, reported } from "../support/factories.ts";
import { sendDigests } from "../../server/services/notification-service.ts";

let t: TestApp;
let producer: SignedInAgent;
let buyer: SignedInAgent;
let mail: Awaited<ReturnType<typeof startTestMail>>;
const P = (p: string) => `/api/orgs/${ORG.troisSentes}${p}`;
const B = (p: string) => `/api/orgs/${ORG.retailer}${p}`;

beforeAll(async () => {
  t = buildTestApp();
  producer = await signInAs(t.app, DEMO.producerQuality);
  buyer = await signInAs(t.app, DEMO.buyerTechnologist);
  mail = await startTestMail();
});
afterAll(async () => {
  await mail.stop();
  await t.close();
});

/** A lot of Sentier Blanc whose pre-filling analysis fails volatile acidity: one open deviation. */
async function failingLot() {
  const maker = await party(DEMO.producerQuality, "producer_quality");
  const { id: lotId } = await plannedLot(maker, CONTRACT.sentierBlanc, {
    lotCode: `SB-DV-${randomUUID().slice(0, 6)}`,
    volumeLitres: 5000,
    plannedDate: null,
  });
  const sent = await reported(maker, lotId, {
    stage: "pre_filling",
    laboratoryName: "Domaine des Trois Sentes cellar laboratory",
    sampleDate: "2026-11-30",
    results: [["volatile_acidity", "0.74", "g/L as acetic acid"]],
  });
  return { lotId, analysisId: sent.analysisId, deviationId: sent.deviationIds[0]! };
}

describe("deviations", () => {
  it("when the producer proposes, the buyer counters with a condition, the producer accepts and the buyer decides, then every step is recorded and mailed", async () => {
    const { deviationId, analysisId } = await failingLot();
    const d0 = (await producer.agent.get(P(`/deviations/${deviationId}`))).body;
    expect(d0).toMatchObject({ status: "open", kind: "result", parameters: ["volatile_acidity"] });
    expect(d0.verdicts[0].outcome).toBe("fail");

    const ask = await producer.agent
      .post(P(`/deviations/${deviationId}/messages`))
      .set("x-csrf-token", producer.csrf)
      .send({
        kind: "proposal",
        body: "We ask a concession: the wine is sound. @tessa.marlow",
        proposal: { outcome: "concession", conditions: [] },
        quote: { analysisId, parameter: "volatile_acidity" },
      });
    expect(ask.status).toBe(201);
    const counter = await buyer.agent
      .post(B(`/deviations/${deviationId}/messages`))
      .set("x-csrf-token", buyer.csrf)
      .send({
        kind: "proposal",
        parentId: ask.body.id,
        body: "Acceptable if an accredited re-test confirms below 0.8 g/L.",
        proposal: { outcome: "concession", conditions: [{ kind: "retest", detail: "Accredited re-test below 0.8 g/L as acetic acid" }] },
      });
    expect(counter.status).toBe(201);
    // Nobody accepts their own proposal.
    expect(
      (
        await buyer.agent
          .post(B(`/deviations/${deviationId}/messages`))
          .set("x-csrf-token", buyer.csrf)
          .send({ kind: "acceptance", parentId: counter.body.id, body: "ok" })
      ).status,
    ).toBe(400);
    expect(
      (
        await producer.agent
          .post(P(`/deviations/${deviationId}/messages`))
          .set("x-csrf-token", producer.csrf)
          .send({ kind: "acceptance", parentId: counter.body.id, body: "We accept the re-test condition." })
      ).status,
    ).toBe(201);
    // Regression: an accepted proposal settles the discussion; nobody can accept again, and the acceptance states the conditions.
    const agreed = (await buyer.agent.get(B(`/deviations/${deviationId}`))).body;
    expect(agreed.status).toBe("agreed");
    expect(agreed.actions.accept).toBe(false);
    expect(agreed.actions.decide).toBe(true);
    expect(agreed.messages.at(-1).body).toBe(
      "Accepted: Concession for this lot, on condition of: re-test: Accredited re-test below 0.8 g/L as acetic acid. We accept the re-test condition.",
    );
    expect(
      (
        await producer.agent
          .post(P(`/deviations/${deviationId}/messages`))
          .set("x-csrf-token", producer.csrf)
          .send({ kind: "acceptance", parentId: counter.body.id, body: "Again." })
      ).status,
    ).toBe(409);
    // Producers propose; only the buyer's technologist decides, and a decision needs a reason.
    expect(
      (
        await producer.agent
          .post(P(`/deviations/${deviationId}/decision`))
          .set("x-csrf-token", producer.csrf)
          .send({ outcome: "concession", conditions: [], reason: "We decide ourselves." })
      ).status,
    ).toBe(403);
    const noReason = await buyer.agent
      .post(B(`/deviations/${deviationId}/decision`))
      .set("x-csrf-token", buyer.csrf)
      .send({ outcome: "concession", conditions: [] });
    expect(noReason.body.errors[0]).toMatchObject({ path: "reason" });
    const decided = await buyer.agent
      .post(B(`/deviations/${deviationId}/decision`))
      .set("x-csrf-token", buyer.csrf)
      .send({
        outcome: "concession",
        conditions: [{ kind: "retest", detail: "Accredited re-test below 0.8 g/L as acetic acid" }],
        reason: "Sound wine; VA below the legal limit; re-test agreed.",
      });
    expect(decided.status).toBe(200);
    const d1 = (await buyer.agent.get(B(`/deviations/${deviationId}`))).body;
    expect(d1.status).toBe("decided");
    expect(d1.messages.map((m: { kind: string }) => m.kind)).toEqual(["proposal", "proposal", "acceptance", "decision"]);
    expect(d1.messages[0].mentions).toEqual(["tessa.marlow"]);
    expect(d1.messages[0].quote).toMatchObject({ parameter: "volatile_acidity", outcome: "fail" });
    expect(
      (
        await producer.agent
          .post(P(`/deviations/${deviationId}/messages`))
          .set("x-csrf-token", producer.csrf)
          .send({ kind: "comment", body: "late" })
      ).status,
    ).toBe(409);

    await mail.deliver();
    expect(mail.to(DEMO.buyerTechnologist).some((m) => m.subject.startsWith("Élise Carbonnel mentioned you on deviation"))).toBe(true);
    expect(mail.to(DEMO.producerQuality).some((m) => m.subject === `Deviation #${deviationId} decided: Concession for this lot`)).toBe(
      true,
    );

    const history = (await producer.agent.get(P(`/history/deviation/${deviationId}`))).body as { action: string }[];
    expect(history.map((h) => h.action)).toEqual([
      "deviation.opened",
      "deviation.proposed",
      "deviation.proposed",
      "deviation.accepted",
      "deviation.decided",
    ]);
    expect((await buyer.agent.get(B("/trail/verify"))).body.ok).toBe(true);
  });

  it("when another producer or the laboratory asks for a deviation, then 404", async () => {
    const { deviationId } = await failingLot();
    const kestrel = await signInAs(t.app, DEMO.bulkProducerQuality);
    expect((await kestrel.agent.get(`/api/orgs/${ORG.kestrelFlats}/deviations/${deviationId}`)).status).toBe(404);
    expect((await kestrel.agent.get(`/api/orgs/${ORG.kestrelFlats}/history/deviation/${deviationId}`)).status).toBe(404);
    const list = (await kestrel.agent.get(`/api/orgs/${ORG.kestrelFlats}/deviations`)).body.items as { contractId: number }[];
    expect(list.every((d) => d.contractId === 3)).toBe(true);
    const lab = await signInAs(t.app, DEMO.labAdmin);
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/deviations/${deviationId}`)).status).toBe(404);
    // The laboratory lists only what its paid audits opened (tests/api/audits.test.ts), never this one.
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/deviations?limit=200`)).body.items.map((d: { id: number }) => d.id)).not.toContain(
      deviationId,
    );
  });

  it("when a producer attaches a PDF to a message and the record is printed, then the file is kept with its hash and the PDF holds the discussion", async () => {
    const { deviationId } = await failingLot();
    const m = await producer.agent
      .post(P(`/deviations/${deviationId}/messages`))
      .set("x-csrf-token", producer.csrf)
      .send({ kind: "comment", body: "Our lab report is attached." });
    const pdf = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
    const up = await producer.agent
      .post(P(`/deviations/${deviationId}/messages/${m.body.id}/attachments`))
      .set("x-csrf-token", producer.csrf)
      .attach("file", pdf, "lab-report.pdf");
    expect(up.status).toBe(201);
    expect(
      (
        await buyer.agent
          .post(B(`/deviations/${deviationId}/messages/${m.body.id}/attachments`))
          .set("x-csrf-token", buyer.csrf)
          .attach("file", pdf, "x.pdf")
      ).status,
    ).toBe(403);
    const detail = (await buyer.agent.get(B(`/deviations/${deviationId}`))).body;
    expect(detail.messages[0].attachments[0]).toMatchObject({ originalName: "lab-report.pdf", sha256: up.body.sha256 });
    const record = await buyer.agent
      .get(B(`/deviations/${deviationId}/pdf`))
      .buffer(true)
      .parse((r, cb) => {
        const c: Buffer[] = [];
        r.on("data", (x: Buffer) => c.push(x));
        r.on("end", () => cb(null, Buffer.concat(c)));
      });
    expect(record.headers["content-type"]).toBe("application/pdf");
    const { execFileSync } = await import("node:child_process");
    const text = execFileSync("pdftotext", ["-", "-"], { input: record.body as Buffer, encoding: "utf8" });
    expect(text).toContain(`Deviation #${deviationId}`);
    expect(text).toContain("Our lab report is attached.");
    // The record states the lot's status in the words every screen uses.
    const lot = (await buyer.agent.get(B(`/deviations/${deviationId}`))).body.lotId;
    const status = (await buyer.agent.get(B(`/lots/${lot}`))).body.status;
    expect(text.replace(/\s+/g, " ")).toContain(`Lot status: ${status.label}. ${status.reason}`);
  });

  it("when a message is edited, then its earlier wording is kept; only its author may edit", async () => {
    const { deviationId } = await failingLot();
    const m = await producer.agent
      .post(P(`/deviations/${deviationId}/messages`))
      .set("x-csrf-token", producer.csrf)
      .send({ kind: "comment", body: "First wording" });
    expect(
      (
        await producer.agent
          .patch(P(`/deviations/${deviationId}/messages/${m.body.id}`))
          .set("x-csrf-token", producer.csrf)
          .send({ body: "Second wording" })
      ).status,
    ).toBe(204);
    expect(
      (
        await buyer.agent
          .patch(B(`/deviations/${deviationId}/messages/${m.body.id}`))
          .set("x-csrf-token", buyer.csrf)
          .send({ body: "Hijack" })
      ).status,
    ).toBe(403);
    const msg = (await buyer.agent.get(B(`/deviations/${deviationId}`))).body.messages[0];
    expect(msg.body).toBe("Second wording");
    expect(msg.edits).toEqual([{ previousBody: "First wording", editedAt: expect.any(String) }]);
  });

  it("when a user chose the daily digest, then notifications wait for one summary mail a day", async () => {
    await mail.deliver();
    const owen = await signInAs(t.app, DEMO.producerAdmin);
    expect(
      (
        await owen.agent
          .put("/api/me/notification-preferences")
          .set("x-csrf-token", owen.csrf)
          .send({ emailMode: "daily_digest", kinds: ["deviation_opened", "comment", "mention", "decision", "deadline"] })
      ).status,
    ).toBe(200);
    await t.sequelize.query(
      "INSERT INTO notifications (user_id, kind, title, body, link, created_at) VALUES (?, 'comment', 'Digest test', 'x', '/deviations/1', NOW(3))",
      { replacements: [owen.userId], type: QueryTypes.INSERT },
    );
    expect(await sendDigests()).toBeGreaterThanOrEqual(1);
    expect(await sendDigests()).toBe(0); // at most one a day
    await mail.deliver();
    expect(mail.to(DEMO.producerAdmin).filter((m) => /update.* since yesterday/.test(m.subject))).toHaveLength(1);
  });

  it("when the org admin exports the trail, then CSV and JSON downloads come with filters applied", async () => {
    const admin = await signInAs(t.app, DEMO.retailerAdmin);
    const csv = await admin.agent.get(B("/trail?format=csv&action=deviation.")).buffer(true);
    expect(csv.headers["content-type"]).toMatch(/text\/csv/);
    expect(csv.text.split("\n")[0]).toContain("seq,occurred_at,actor,action");
    expect(csv.text).toContain("deviation.decided");
    // Each row also says what happened in words.
    expect(csv.text).toContain("Deviation decided");
    const json = await admin.agent.get(B("/trail?format=json&entityType=deviation")).buffer(true);
    expect(JSON.parse(json.text).every((e: { entityType: string }) => e.entityType === "deviation")).toBe(true);
  });
});

describe("deviations opened by hand", () => {
  it("when the buyer opens one with a reason, then both parties see it; without a reason it is refused", async () => {
    const { lotId } = await failingLot();
    const bad = await buyer.agent.post(B("/deviations")).set("x-csrf-token", buyer.csrf).send({ lotId, parameters: [], reason: "short" });
    expect(bad.body.errors[0]).toMatchObject({ path: "reason" });
    const ok = await buyer.agent
      .post(B("/deviations"))
      .set("x-csrf-token", buyer.csrf)
      .send({ lotId, parameters: ["turbidity"], reason: "Visible haze in the retained sample at our tasting panel." });
    expect(ok.status).toBe(201);
    const seen = (await producer.agent.get(P(`/deviations/${ok.body.id}`))).body;
    expect(seen).toMatchObject({ kind: "manual", status: "open", parameters: ["turbidity"] });
    expect(seen.summary).toContain("Visible haze");
  });
});
