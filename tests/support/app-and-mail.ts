/**
 * The app on the test database and the SMTP fake it mails through, opened before a test file's tests
 * and closed after them. A file calls `openAppAndMail()` once at its top and reads `t` and `mail`,
 * which are set by the time its tests run.
 */
import { afterAll, beforeAll } from "vitest";
import { buildTestApp, type TestApp } from "./api.ts";
import { startTestMail } from "./mail.ts";

export let t: TestApp;
export let mail: Awaited<ReturnType<typeof startTestMail>>;

export function openAppAndMail(): void {
  beforeAll(async () => {
    t = buildTestApp();
    mail = await startTestMail();
  });
  afterAll(async () => {
    await mail.stop();
    await t.close();
  });
}
