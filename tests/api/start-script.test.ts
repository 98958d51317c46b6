/**
 * The demo's start command stops what it started when interrupted at any moment (common practice
 * for a launcher; POSIX trap on INT). Run here on a private MariaDB of its own (own folder and
 * port), interrupted with SIGINT to its process group — what Ctrl-C sends — while it is migrating.
 */
import { describe, expect, it } from "vitest";
import { spawn } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "../..");
const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

describe("the start command", () => {
  it("when Ctrl-C comes right after MariaDB is up, then MariaDB is stopped too and the command exits", async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "cellarpact-start-"));
    const child = spawn("bash", ["server/scripts/start.sh"], {
      cwd: root,
      detached: true,
      env: {
        ...process.env,
        DB_DIR: dir,
        DB_PORT: "3499",
        PORT: "3991",
        SMTP_PORT: "2991",
        MAIL_FAKE_HTTP_PORT: "2992",
        STRIPE_API_PORT: "12991",
      },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let output = "";
    child.stdout.on("data", (d) => (output += d));
    child.stderr.on("data", (d) => (output += d));
    const exited = new Promise<number | null>((r) => child.once("exit", (code) => r(code)));
    try {
      const deadline = Date.now() + 60_000;
      while (!/MariaDB ready/.test(output) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      expect(output).toMatch(/MariaDB ready/);
      const pid = Number(readFileSync(path.join(dir, "run", "mysqld.pid"), "utf8"));
      expect(alive(pid)).toBe(true);
      process.kill(-child.pid!, "SIGINT");
      expect(await exited).not.toBe(0);
      expect(alive(pid), `MariaDB (pid ${pid}) still running after Ctrl-C:\n${output}`).toBe(false);
    } finally {
      if (child.exitCode === null) process.kill(-child.pid!, "SIGKILL");
      if (existsSync(path.join(dir, "run", "mysqld.pid"))) {
        const pid = Number(readFileSync(path.join(dir, "run", "mysqld.pid"), "utf8"));
        if (alive(pid)) process.kill(pid, "SIGKILL");
      }
      rmSync(dir, { recursive: true, force: true });
    }
  }, 90_000);
});
