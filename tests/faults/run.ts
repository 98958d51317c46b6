/**
 * npm run test:faults — the app and its database killed at bad moments, on a private MariaDB and
 * fresh ports, bounded and self-stopping. Prints, and fails on: batches partial (goal 0),
 * acknowledged writes missing (goal 0), mails lost (goal 0); and reports mails sent twice (allowed:
 * delivery is at least once, with a stable Message-ID) and the time to recover.
 */
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { execFileSync } from "node:child_process";
import { faultDatabase, root, signIn, startApp, type AppProcess } from "./processes.ts";
import { startMailFake } from "../../server/fakes/mail-fake.ts";
import { DEMO_PASSWORD } from "../../seeders/2026.12.02T02.00.00.demo-organisations-and-people.ts";

const KILLS = Number(process.env.FAULT_KILLS ?? 10);
const dir = mkdtempSync(path.join(os.tmpdir(), "cellarpact-faults-"));
const db = faultDatabase(dir, 3497);
const mail = await startMailFake();
const env = {
  ...db.env,
  SMTP_PORT: String(mail.smtpPort),
  OUTBOX_POLL_MS: "50",
  OUTBOX_RETRY_BASE_MS: "100",
  BCRYPT_COST: "4",
  LOGIN_LIMIT_PER_IP: "100000",
};
const APP_PORT = 3996;
const random = (lo: number, hi: number) => lo + Math.random() * (hi - lo);
const failures: string[] = [];
let app: AppProcess | null = null;

try {
  db.start();
  const migrate = (cmd: string) =>
    execFileSync(process.execPath, ["--import", "tsx", "server/scripts/migrate.ts", cmd], {
      cwd: root,
      env: { ...process.env, ...env },
      stdio: "ignore",
    });
  migrate("up");
  migrate("seed");
  const [contract] = await db.query<{ id: number; producer: number }>(
    "SELECT c.id, c.producer_org_id AS producer FROM contracts c JOIN organisations o ON o.id = c.producer_org_id WHERE o.name LIKE 'Domaine des Trois Sentes%' ORDER BY c.id LIMIT 1",
  );

  // 1. kill -9 during large imports.
  let partial = 0;
  let ackedMissing = 0;
  const recoveries: number[] = [];
  for (let k = 0; k < KILLS; k++) {
    ({ app } = await startApp(env, APP_PORT));
    const producer = await signIn(app.url, "elise.carbonnel@troissentes.test", DEMO_PASSWORD);
    const prefix = `FAULT-${k}-`;
    const samples = Array.from({ length: 2000 }, (_, i) => ({
      lotCode: `${prefix}${i}`,
      vintage: 2025,
      sampleDate: "2026-12-01",
      results: [
        { parameter: "alcohol", raw: "12.5", unit: "% vol" },
        { parameter: "free_so2", raw: String(20 + (i % 15)), unit: "mg/L" },
      ],
    }));
    const body = JSON.stringify({
      idempotencyKey: `fault-import-${k}-${Date.now()}`,
      stage: "pre_filling",
      laboratoryName: "Fault laboratory",
      samples,
    });
    const answer = fetch(`${app.url}/api/orgs/${contract!.producer}/contracts/${contract!.id}/imports`, {
      method: "POST",
      headers: producer.headers,
      body,
    })
      .then((r) => r.status)
      .catch(() => 0);
    await new Promise((r) => setTimeout(r, random(20, 1500)));
    await app.kill();
    const status = await answer;
    const t0 = performance.now();
    ({ app } = await startApp(env, APP_PORT));
    recoveries.push(performance.now() - t0);
    const [count] = await db.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM analyses a JOIN lots l ON l.id = a.lot_id WHERE l.lot_code LIKE ?",
      [`${prefix}%`],
    );
    const stored = Number(count!.n);
    if (stored !== 0 && stored !== 2000) partial += 1;
    if (status >= 200 && status < 300 && stored !== 2000) ackedMissing += 1;
    await app.kill();
  }
  console.log(`Fault: kill -9 of the app during ${KILLS} imports of 2,000 samples`);
  console.log(`  batches partial: ${partial} (goal 0); acknowledged imports missing: ${ackedMissing} (goal 0)`);
  console.log(
    `  time to recover (restart to healthy): median ${median(recoveries).toFixed(0)} ms, longest ${Math.max(...recoveries).toFixed(0)} ms`,
  );
  if (partial) failures.push(`${partial} import batches partial`);
  if (ackedMissing) failures.push(`${ackedMissing} acknowledged imports missing`);

  // 2. kill -9 with mail in the outbox.
  mail.messages.length = 0;
  await db.query("DELETE FROM outbox_messages");
  const MAILS = 600;
  const values = Array.from(
    { length: MAILS },
    (_, i) => `(UUID(), 'reader${i}@example.test', 'Fault mail ${i}', 'x', NOW(3), NOW(3), NOW(3), ${i % 2})`,
  ).join(",");
  await db.query(
    `INSERT INTO outbox_messages (message_key, to_address, subject, text_body, next_attempt_at, created_at, updated_at, priority) VALUES ${values}`,
  );
  ({ app } = await startApp(env, APP_PORT));
  while (mail.messages.length < MAILS / 4) await new Promise((r) => setTimeout(r, 5));
  await app.kill();
  const t1 = performance.now();
  ({ app } = await startApp(env, APP_PORT));
  for (;;) {
    const [left] = await db.query<{ n: number }>("SELECT COUNT(*) AS n FROM outbox_messages WHERE status <> 'sent'");
    if (Number(left!.n) === 0 || performance.now() - t1 > 60_000) break;
    await new Promise((r) => setTimeout(r, 50));
  }
  const drained = performance.now() - t1;
  const keys = await db.query<{ k: string }>("SELECT message_key AS k FROM outbox_messages");
  const seen = new Map<string, number>();
  for (const m of mail.messages) seen.set(m.messageId ?? "", (seen.get(m.messageId ?? "") ?? 0) + 1);
  const lost = keys.filter((k) => !seen.has(`<${k.k}@cellarpact.test>`)).length;
  const twice = [...seen.values()].filter((c) => c > 1).length;
  console.log(`Fault: kill -9 of the app with ${MAILS} mails in the outbox, a quarter of them sent`);
  console.log(
    `  mails lost: ${lost} (goal 0); mails sent twice: ${twice} (at least once; same Message-ID); outbox drained ${drained.toFixed(0)} ms after the restart`,
  );
  if (lost) failures.push(`${lost} mails lost`);

  // 3. kill -9 of MariaDB under a write load.
  const writer = await signIn(app.url, "elise.carbonnel@troissentes.test", DEMO_PASSWORD);
  const acked: string[] = [];
  let stop = false;
  let refusedWhileDown = 0;
  const load = (async () => {
    for (let i = 0; !stop; i++) {
      const lotCode = `DBKILL-${i}`;
      const res = await fetch(`${app!.url}/api/orgs/${contract!.producer}/lots`, {
        method: "POST",
        headers: writer.headers,
        body: JSON.stringify({ contractId: contract!.id, vintage: 2025, lotCode, volumeLitres: 1000, container: "bottles", market: "EU" }),
      }).catch(() => null);
      if (res?.status === 201) acked.push(lotCode);
      else if (res?.status === 503) refusedWhileDown += 1;
    }
  })();
  await new Promise((r) => setTimeout(r, 1500));
  db.kill();
  await new Promise((r) => setTimeout(r, 500));
  const t2 = performance.now();
  db.start();
  const ackedBefore = acked.length;
  while (acked.length === ackedBefore && performance.now() - t2 < 60_000) await new Promise((r) => setTimeout(r, 20));
  const dbRecovered = performance.now() - t2;
  await new Promise((r) => setTimeout(r, 500));
  stop = true;
  await load;
  const stored = new Set((await db.query<{ c: string }>("SELECT lot_code AS c FROM lots WHERE lot_code LIKE 'DBKILL-%'")).map((r) => r.c));
  const missing = acked.filter((c) => !stored.has(c)).length;
  console.log(`Fault: kill -9 of MariaDB under a write load (${acked.length} lot registrations acknowledged)`);
  console.log(
    `  acknowledged writes missing: ${missing} (goal 0); answered 503 while down: ${refusedWhileDown}; writes acknowledged again ${dbRecovered.toFixed(0)} ms after the restart`,
  );
  if (missing) failures.push(`${missing} acknowledged lot registrations missing`);
} finally {
  await app?.kill();
  await mail.stop();
  try {
    db.stop();
  } catch {
    /* already down */
  }
  rmSync(dir, { recursive: true, force: true });
}

function median(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? 0;
}

if (failures.length) {
  console.error(`FAULT TESTS FAILED: ${failures.join("; ")}`);
  process.exit(1);
}
console.log("fault tests passed");
