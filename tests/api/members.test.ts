import { describe, expect, it } from "vitest";
import request from "supertest";
import { DEMO, ORG, signInAs, uniqueEmail } from "../support/api.ts";
import { linkIn } from "../support/mail.ts";
import { mail, openAppAndMail, t } from "../support/app-and-mail.ts";

openAppAndMail();

describe("invitations", () => {
  it("when an admin invites someone, then the mailed link creates the account, the membership and a session", async () => {
    const admin = await signInAs(t.app, DEMO.producerAdmin);
    const email = uniqueEmail("cellar.hand");
    const sent = await admin.agent
      .post(`/api/orgs/${ORG.troisSentes}/invitations`)
      .set("x-csrf-token", admin.csrf)
      .send({ email, role: "producer_quality" });
    expect(sent.status).toBe(201);
    await mail.deliver();
    const token = linkIn(mail.to(email)[0]!.text, "/accept-invitation");

    const preview = await request(t.app).get(`/api/invitations/${token}`);
    expect(preview.body).toMatchObject({ email, role: "producer_quality", organisationName: "Domaine des Trois Sentes" });

    const accepted = await request(t.app)
      .post("/api/invitations/accept")
      .send({ token, name: "Lou Bérard", password: "Grand-cru-password" });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user.memberships[0]).toMatchObject({ organisationId: ORG.troisSentes, role: "producer_quality" });
    expect((await request(t.app).post("/api/invitations/accept").send({ token, name: "Lou", password: "Grand-cru-password" })).status).toBe(
      410,
    );
    expect((await request(t.app).post("/api/auth/sign-in").send({ email, password: "Grand-cru-password" })).status).toBe(200);
  });

  it("when the role does not fit the organisation's kind, then the field gets a message and nothing is sent", async () => {
    const admin = await signInAs(t.app, DEMO.producerAdmin);
    const res = await admin.agent
      .post(`/api/orgs/${ORG.troisSentes}/invitations`)
      .set("x-csrf-token", admin.csrf)
      .send({ email: uniqueEmail(), role: "buyer_finance" });
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([{ path: "role", message: "Buyer finance is not a role in a producer organisation." }]);
  });

  it("when someone who is not an admin invites, then 403 names the needed role", async () => {
    const quality = await signInAs(t.app, DEMO.producerQuality);
    const res = await quality.agent
      .post(`/api/orgs/${ORG.troisSentes}/invitations`)
      .set("x-csrf-token", quality.csrf)
      .send({ email: uniqueEmail(), role: "producer_quality" });
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/Organisation admin/);
  });
});

describe("tenancy", () => {
  it("when a member of one organisation asks for another's data, then every route answers 404", async () => {
    const admin = await signInAs(t.app, DEMO.producerAdmin);
    const other = ORG.kestrelFlats;
    expect((await admin.agent.get(`/api/orgs/${other}`)).status).toBe(404);
    expect((await admin.agent.get(`/api/orgs/${other}/members`)).status).toBe(404);
    expect((await admin.agent.get(`/api/orgs/${other}/invitations`)).status).toBe(404);
    expect((await admin.agent.get(`/api/orgs/${other}/trail`)).status).toBe(404);
    expect(
      (
        await admin.agent
          .post(`/api/orgs/${other}/invitations`)
          .set("x-csrf-token", admin.csrf)
          .send({ email: uniqueEmail(), role: "producer_quality" })
      ).status,
    ).toBe(404);
    expect(
      (await admin.agent.patch(`/api/orgs/${other}/members/1`).set("x-csrf-token", admin.csrf).send({ role: "org_admin" })).status,
    ).toBe(404);
    expect((await admin.agent.delete(`/api/orgs/${other}/members/1`).set("x-csrf-token", admin.csrf)).status).toBe(404);
  });

  it("when an admin names a membership of another organisation under their own, then 404", async () => {
    const admin = await signInAs(t.app, DEMO.producerAdmin);
    const retailerMembers = await (await signInAs(t.app, DEMO.retailerAdmin)).agent.get(`/api/orgs/${ORG.retailer}/members`);
    const foreign = retailerMembers.body[0].membershipId;
    const res = await admin.agent
      .patch(`/api/orgs/${ORG.troisSentes}/members/${foreign}`)
      .set("x-csrf-token", admin.csrf)
      .send({ role: "org_admin" });
    expect(res.status).toBe(404);
  });
});

describe("roles", () => {
  it("when an admin changes a role, then the member's old session stops working and the change is in the log", async () => {
    const admin = await signInAs(t.app, DEMO.labAdmin);
    const analyst = await signInAs(t.app, DEMO.labAnalyst);
    const members = (await admin.agent.get(`/api/orgs/${ORG.lab}/members`)).body as { membershipId: number; email: string }[];
    const target = members.find((m) => m.email === DEMO.labAnalyst)!;
    const changed = await admin.agent
      .patch(`/api/orgs/${ORG.lab}/members/${target.membershipId}`)
      .set("x-csrf-token", admin.csrf)
      .send({ role: "org_admin" });
    expect(changed.status).toBe(200);
    expect(changed.body.role).toBe("org_admin");
    expect((await analyst.agent.get(`/api/orgs/${ORG.lab}/members`)).status).toBe(401);
    const log = (await admin.agent.get(`/api/orgs/${ORG.lab}/trail`)).body.items as { action: string; details: { to?: string } }[];
    expect(log.find((e) => e.action === "membership.role_changed")?.details.to).toBe("org_admin");
    // Restore the demo role.
    await admin.agent
      .patch(`/api/orgs/${ORG.lab}/members/${target.membershipId}`)
      .set("x-csrf-token", admin.csrf)
      .send({ role: "lab_analyst" });
  });

  it("when the last admin would be demoted, then 409 and the role stays", async () => {
    const admin = await signInAs(t.app, DEMO.retailerAdmin);
    const members = (await admin.agent.get(`/api/orgs/${ORG.retailer}/members`)).body as {
      membershipId: number;
      email: string;
      role: string;
    }[];
    const self = members.find((m) => m.email === DEMO.retailerAdmin)!;
    const res = await admin.agent
      .patch(`/api/orgs/${ORG.retailer}/members/${self.membershipId}`)
      .set("x-csrf-token", admin.csrf)
      .send({ role: "buyer_finance" });
    expect(res.status).toBe(409);
    const after = (await admin.agent.get(`/api/orgs/${ORG.retailer}/members`)).body as { email: string; role: string }[];
    expect(after.find((m) => m.email === DEMO.retailerAdmin)?.role).toBe("org_admin");
  });
});

describe("platform admin", () => {
  it("when the platform admin opens an organisation, then its first admin is invited; others get 403", async () => {
    const platform = await signInAs(t.app, DEMO.platformAdmin);
    const adminEmail = uniqueEmail("owner");
    const name = `Bodega Test ${Date.now()}`;
    const res = await platform.agent
      .post("/api/platform/organisations")
      .set("x-csrf-token", platform.csrf)
      .send({ name, kind: "producer", country: "es", adminEmail });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name, kind: "producer", country: "ES" });
    await mail.deliver();
    expect(mail.to(adminEmail)[0]?.subject).toBe(`${name} is ready on Cellarpact`);
    const buyer = await signInAs(t.app, DEMO.buyerTechnologist);
    expect((await buyer.agent.get("/api/platform/organisations")).status).toBe(403);
  });
});
