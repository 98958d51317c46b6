/** Test helpers: the real app on the real test database, driven over HTTP with supertest. */
import request from "supertest";
import { execFileSync } from "node:child_process";
import { pino } from "pino";
import type { Express } from "express";
import type { Sequelize } from "sequelize";
import { loadConfig, type Config } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { useDatabase } from "../../server/db/database.ts";
import { createApp } from "../../server/app.ts";
import type { RouteRegistry } from "../../server/http/route-registry.ts";
import { DEMO_PASSWORD } from "../../seeders/2026.12.02T02.00.00.demo-organisations-and-people.ts";

export { DEMO_PASSWORD };

export interface TestApp {
  app: Express;
  registry: RouteRegistry;
  config: Config;
  sequelize: Sequelize;
  close(): Promise<void>;
}

export function buildTestApp(overrides: Record<string, string> = {}): TestApp {
  const config = loadConfig({ ...process.env, ...overrides });
  const sequelize = createSequelize(config);
  useDatabase(sequelize);
  const { app, registry } = createApp(config, pino({ level: "silent" }));
  return { app, registry, config, sequelize, close: () => sequelize.close() };
}

export interface SignedInAgent {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  userId: number;
}

export async function signInAs(app: Express, email: string, password = DEMO_PASSWORD): Promise<SignedInAgent> {
  const agent = request.agent(app);
  const res = await agent.post("/api/auth/sign-in").send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, csrf: res.body.csrfToken, userId: res.body.user.id };
}

let counter = 0;
/** A fresh address per call, so tests never depend on each other's rows. */
export const uniqueEmail = (prefix = "person") => `${prefix}.${Date.now().toString(36)}${(counter++).toString(36)}@example.test`;

export const DEMO = {
  platformAdmin: "sam.okafor@cellarpact.test",
  buyerTechnologist: "tessa.marlow@harbourline.test",
  buyerFinance: "owen.pryce@harbourline.test",
  retailerAdmin: "rhiannon.vale@harbourline.test",
  producerQuality: "elise.carbonnel@troissentes.test",
  producerAdmin: "mathieu.rocheval@troissentes.test",
  bulkProducerQuality: "priya.anand@kestrelflats.test",
  valsordaQuality: "giulia.ferrante@valsorda.test",
  labAnalyst: "amos.kellett@northgate-lab.test",
  labAdmin: "nadia.brook@northgate-lab.test",
} as const;

/** The demo organisations and contracts, by name and reference; their ids are looked up before each file (tests/support/demo-rows.ts). */
export const ORGANISATION_NAMES = {
  retailer: "Harbourline Grocers",
  troisSentes: "Domaine des Trois Sentes",
  kestrelFlats: "Kestrel Flats Estate",
  valsorda: "Cantina Valsorda",
  lab: "Northgate Oenology Laboratory",
} as const;
export const CONTRACT_REFERENCES = {
  sentierBlanc: "HG-C-2024-017",
  sentierRouge: "HG-C-2025-021",
  kestrelShiraz: "HG-C-2024-009",
  valsordaRosato: "HG-C-2025-030",
} as const;
export const ORG = {} as Record<keyof typeof ORGANISATION_NAMES, number>;
export const CONTRACT = {} as Record<keyof typeof CONTRACT_REFERENCES, number>;

/** GETs a PDF and reads its text back with poppler's pdftotext. */
export async function getPdf(agent: SignedInAgent["agent"], url: string) {
  const res = await agent
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (x: Buffer) => chunks.push(x));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
  const text = res.status === 200 ? execFileSync("pdftotext", ["-", "-"], { input: res.body as Buffer, encoding: "utf8" }) : "";
  return { status: res.status, type: res.headers["content-type"] as string | undefined, text: text.replace(/\s+/g, " ") };
}
