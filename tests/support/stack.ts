/**
 * The real stack for browser tests: the built client served by the real server process on the test
 * database, the SMTP fake, and Debian's Chromium driven by playwright-core.
 */
import { spawn, execSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, mkdirSync, rmSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import axe from "axe-core";
import { expect } from "vitest";
import { startMailFake, type MailFake } from "../../server/fakes/mail-fake.ts";
import { startStripeFake, type StripeFake } from "../../server/fakes/stripe/server.ts";
import { DEMO_PASSWORD } from "./api.ts";

const root = path.resolve(import.meta.dirname, "../..");
export const SCREENS = path.join(root, "test-results", "screens");

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const port = (srv.address() as net.AddressInfo).port;
      srv.close(() => resolve(port));
    });
  });
}

export function chromiumPath(): string {
  for (const candidate of [process.env.CHROMIUM_PATH, "/usr/bin/chromium", "/usr/bin/chromium-browser"]) {
    if (candidate && existsSync(candidate)) return candidate;
  }
  return execSync("command -v chromium", { encoding: "utf8" }).trim();
}

export interface Stack {
  baseUrl: string;
  /** The mail fake's own inbox page, on its loopback port: the app never serves mail. */
  inboxUrl: string;
  mail: MailFake;
  stripe: StripeFake;
  context: BrowserContext;
  page: Page;
  stop(): Promise<void>;
}

/** Uncaught errors of the pages of the stack that runs now (one per test file). */
const pageErrors: string[] = [];

export async function startStack(): Promise<Stack> {
  if (!existsSync(path.join(root, "dist", "index.html")))
    throw new Error("dist/ is missing: run `npx vite build` before the browser tests");
  const mail = await startMailFake();
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const webhookSecret = "whsec_e2e_local_secret_0123456789";
  const stripe = await startStripeFake({ webhook: { url: `${baseUrl}/api/webhooks/stripe`, secret: webhookSecret, retryBaseMs: 200 } });
  const server: ChildProcess = spawn(process.execPath, ["--import", "tsx", "server/main.ts"], {
    cwd: root,
    env: {
      ...process.env,
      PORT: String(port),
      APP_URL: baseUrl,
      CLIENT_DIR: "dist",
      SMTP_PORT: String(mail.smtpPort),
      STRIPE_API_PORT: String(stripe.port),
      STRIPE_WEBHOOK_SECRET: webhookSecret,
      LOGIN_LIMIT_PER_ACCOUNT: "50",
      LOG_LEVEL: "warn",
    },
    stdio: ["ignore", "inherit", "inherit"],
  });
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) break;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline || server.exitCode !== null) throw new Error("the server did not start");
    await new Promise((r) => setTimeout(r, 150));
  }
  const profileDir = mkdtempSync(path.join(os.tmpdir(), "cellarpact-e2e-"));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: chromiumPath(),
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  // An uncaught error on any page fails the file: expectAccessible reports it at once, stop() at the end.
  pageErrors.length = 0;
  page.on("pageerror", (err) => pageErrors.push(`${page.url()}: ${err.stack ?? err.message}`));
  // Fail a step well before the test times out, so the report names the locator that was missing.
  page.setDefaultTimeout(10_000);
  mkdirSync(SCREENS, { recursive: true });
  return {
    baseUrl,
    inboxUrl: `http://127.0.0.1:${mail.httpPort}/`,
    mail,
    stripe,
    context,
    page,
    async stop() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
      server.kill("SIGTERM");
      await new Promise((r) => server.once("exit", r));
      await mail.stop();
      await stripe.stop();
      expect(pageErrors, "uncaught errors on the pages").toEqual([]);
    },
  };
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  // Start signed out even if an earlier step left a session behind.
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByRole("navigation", { name: "Main" }).waitFor();
}

export async function signOut(page: Page) {
  await page.getByRole("button", { name: "Sign out" }).click();
  await page.getByRole("heading", { name: "Sign in" }).waitFor();
}

/** Opens the mail fake's inbox, reloading until a mail with this subject has arrived; answers that mail's article. */
export async function openMail(page: Page, inboxUrl: string, subject: string | RegExp) {
  const deadline = Date.now() + 15_000;
  for (;;) {
    await page.goto(inboxUrl);
    const mail = page
      .getByRole("article")
      .filter({ has: page.getByRole("heading", { name: subject }) })
      .first();
    if ((await mail.count()) > 0) return mail;
    if (Date.now() > deadline) throw new Error(`no mail "${subject}" arrived in the inbox within 15 s`);
    await page.waitForTimeout(250);
  }
}

/** axe-core on the current page: no serious or critical violation (WCAG 2.x rules as axe encodes them). */
export async function expectAccessible(page: Page, label: string) {
  expect(pageErrors, `uncaught errors on the pages before ${label}`).toEqual([]);
  // Evaluated rather than added as a script tag, so the app's Content-Security-Policy does not stop it.
  await page.evaluate(axe.source);
  const result = await page.evaluate(() => (window as unknown as { axe: typeof axe }).axe.run(document, { resultTypes: ["violations"] }));
  const bad = result.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${label}: ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

export const screenshot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENS, `${name}.png`), fullPage: true });
