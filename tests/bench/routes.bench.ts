/**
 * The hot routes at 1,000 and at 100,000 lots, each beside a bare Express 5 + mariadb server that
 * answers the same JSON with hand-written SQL (tests/bench/bare-server.ts), in this one process.
 * Prints per route: p50 at both sizes and their ratio (goal ≤ 2), SQL statements per request at both
 * sizes (goal: equal), Cellarpact against bare (goal ≥ 0.5, where a bare twin exists), and the
 * longest event-loop block during the heaviest request at 100k (goal < 100 ms).
 * Set BENCH_LARGE to change the large size.
 */
import { monitorEventLoopDelay } from "node:perf_hooks";
import type { AddressInfo } from "node:net";
import { pino } from "pino";
import { openBenchDatabase } from "./bench-db.ts";
import { loadConfig } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { useDatabase } from "../../server/db/database.ts";
import { createMigrator, createSeeder } from "../../server/db/migrator.ts";
import { dropAllTables } from "../../server/db/reset.ts";
import { demoSize, growDemo } from "../../server/db/grow-demo.ts";
import { createApp } from "../../server/app.ts";
import { startBareServer } from "./bare-server.ts";
import { DEMO_PASSWORD } from "../../seeders/2026.12.02T02.00.00.demo-organisations-and-people.ts";

const LARGE = Number(process.env.BENCH_LARGE ?? 100_000);
const RUNS = 25;
const benchDb = openBenchDatabase();

const config = loadConfig({ ...process.env, DB_NAME: "cellarpact_bench", LOG_LEVEL: "silent", BCRYPT_COST: "4" });
const sequelize = createSequelize(config);
useDatabase(sequelize);
// The statements each request runs, counted through Sequelize's logging hook.
let statements = 0;
(sequelize as unknown as { options: { logging: (sql: string) => void } }).options.logging = () => void statements++;

const { app } = createApp(config, pino({ level: "silent" }));
const server = app.listen(0, "127.0.0.1");
await new Promise((r) => server.once("listening", r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
const bare = await startBareServer(config);

interface Route {
  name: string;
  path: (ctx: { orgId: number; lotId: number }) => string;
  bare?: boolean;
}
const ROUTES: Route[] = [
  // What any signed-in request costs before its own work: middleware, the session token and the user.
  { name: "session", path: () => "/api/auth/session" },
  { name: "lots", path: (c) => `/api/orgs/${c.orgId}/lots?limit=50`, bare: true },
  { name: "lot", path: (c) => `/api/orgs/${c.orgId}/lots/${c.lotId}`, bare: true },
  { name: "readiness", path: (c) => `/api/orgs/${c.orgId}/readiness?limit=50`, bare: true },
  { name: "deviations", path: (c) => `/api/orgs/${c.orgId}/deviations?limit=50`, bare: true },
  { name: "specs", path: (c) => `/api/orgs/${c.orgId}/specs?limit=50`, bare: true },
];

async function signIn() {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email: "tessa.marlow@harbourline.test", password: DEMO_PASSWORD }),
  });
  const body = (await res.json()) as { user: { memberships: { organisationId: number }[] } };
  return {
    cookie: res.headers
      .getSetCookie()
      .map((c) => c.split(";")[0])
      .join("; "),
    orgId: body.user.memberships[0]!.organisationId,
  };
}

async function p50(url: string, headers: Record<string, string>) {
  const times: number[] = [];
  for (let i = 0; i < RUNS + 3; i++) {
    const t = performance.now();
    const res = await fetch(url, { headers });
    if (res.status !== 200) throw new Error(`${url} answered ${res.status}: ${(await res.text()).slice(0, 200)}`);
    await res.arrayBuffer();
    if (i >= 3) times.push(performance.now() - t);
  }
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)]!;
}

async function measure() {
  const session = await signIn();
  const headers = { cookie: session.cookie };
  const [{ id: lotId }] = (await sequelize.query("SELECT l.id FROM lots l JOIN analyses a ON a.lot_id = l.id ORDER BY l.id DESC LIMIT 1", {
    type: "SELECT" as never,
  })) as unknown as [{ id: number }];
  const ctx = { orgId: session.orgId, lotId };
  const out: Record<string, { p50: number; statements: number; bare?: number; same?: boolean }> = {};
  for (const r of ROUTES) {
    statements = 0;
    await fetch(`${base}${r.path(ctx)}`, { headers }).then((x) => x.arrayBuffer());
    const perRequest = statements;
    out[r.name] = { p50: await p50(`${base}${r.path(ctx)}`, headers), statements: perRequest };
    if (r.bare) {
      out[r.name]!.bare = await p50(`${bare.url}${r.path(ctx)}`, {});
      // The twin is a floor only if it answers the same: the same rows, in the same order, the same total.
      const [mine, twin] = await Promise.all([
        fetch(`${base}${r.path(ctx)}`, { headers }).then((x) => x.json()),
        fetch(`${bare.url}${r.path(ctx)}`).then((x) => x.json()),
      ]);
      out[r.name]!.same = JSON.stringify(mine) === JSON.stringify(twin);
      if (!out[r.name]!.same) console.log(`  ${r.name}: the twin differs first at ${firstDifference(mine, twin)}`);
    }
  }
  return { out, ctx, headers };
}

/** The path of the first value two answers disagree on, to mend a twin by. */
function firstDifference(a: unknown, b: unknown, path = "$"): string | null {
  if (JSON.stringify(a) === JSON.stringify(b)) return null;
  if (a && b && typeof a === "object" && typeof b === "object") {
    for (const k of new Set([...Object.keys(a), ...Object.keys(b)])) {
      const d = firstDifference((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`);
      if (d) return d;
    }
  }
  return `${path}: ${JSON.stringify(a)?.slice(0, 80)} ≠ ${JSON.stringify(b)?.slice(0, 80)}`;
}

async function rebuild(lots: number) {
  await growDemo(sequelize, lots);
  const size = await demoSize(sequelize);
  return `${size.lots.toLocaleString("en-GB")} lots, ${size.analyses.toLocaleString("en-GB")} analyses, ${size.results.toLocaleString("en-GB")} results`;
}

await dropAllTables(sequelize);
await createMigrator(sequelize).up();
await createSeeder(sequelize).up();
const smallSize = await rebuild(1000 - (await demoSize(sequelize)).lots);
const small = await measure();
const largeSize = await rebuild(LARGE - 1000);
const large = await measure();

// The heaviest request at the large size, with the event loop watched at 1 ms resolution.
const loop = monitorEventLoopDelay({ resolution: 1 });
loop.enable();
for (const r of ROUTES) await fetch(`${base}${r.path(large.ctx)}`, { headers: large.headers }).then((x) => x.arrayBuffer());
loop.disable();

console.log(`Hot routes: small ${smallSize}; large ${largeSize}; p50 of ${RUNS} requests each`);
console.log("  route        p50 small   p50 large   large/small   statements small/large   bare p50 large   bare/Cellarpact   same JSON");
for (const r of ROUTES) {
  const s = small.out[r.name]!;
  const l = large.out[r.name]!;
  console.log(
    `  ${r.name.padEnd(11)} ${s.p50.toFixed(1).padStart(8)} ms ${l.p50.toFixed(1).padStart(8)} ms ${(l.p50 / s.p50).toFixed(2).padStart(10)}×` +
      `   ${String(s.statements).padStart(8)} / ${String(l.statements).padEnd(12)}` +
      (l.bare
        ? `   ${l.bare.toFixed(1).padStart(8)} ms   ${(l.bare / l.p50).toFixed(2).padStart(8)} (goal ≥ 0.5)   ${s.same && l.same ? "yes" : "NO"}`
        : "   (no bare twin)"),
  );
}
console.log(
  `  longest event-loop block while each route answered once at the large size: ${(loop.max / 1e6).toFixed(0)} ms (goal < 100 ms)`,
);

server.close();
await bare.close();
await sequelize.close();
benchDb.stop();
