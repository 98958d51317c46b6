/** The pieces a fault test kills: a private MariaDB, the app, and the mail fake, each on its own ports. */
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import * as mariadb from "mariadb";

export const root = path.resolve(import.meta.dirname, "../..");

export interface FaultDb {
  env: Record<string, string>;
  start(): void;
  /** kill -9 of mariadbd: no shutdown, no flush beyond what InnoDB already made durable. */
  kill(): void;
  stop(): void;
  query<T>(sql: string, values?: unknown[]): Promise<T[]>;
}

export function faultDatabase(dir: string, port: number): FaultDb {
  const env = { DB_DIR: dir, DB_PORT: String(port), DB_NAME: "cellarpact", DB_NAMES: "cellarpact" };
  const db = (cmd: string) =>
    execFileSync("bash", ["server/scripts/db.sh", cmd], { cwd: root, env: { ...process.env, ...env }, stdio: "ignore" });
  return {
    env,
    start: () => db("start"),
    kill: () => {
      const pid = Number(readFileSync(path.join(dir, "run", "mysqld.pid"), "utf8"));
      process.kill(pid, "SIGKILL");
      // Gone once the kernel has torn it down (or it is only a zombie left for its parent).
      for (const until = Date.now() + 10_000; Date.now() < until;) {
        try {
          if (readFileSync(`/proc/${pid}/stat`, "utf8").split(" ")[2] === "Z") break;
          execFileSync("sleep", ["0.05"]);
        } catch {
          break;
        }
      }
    },
    stop: () => db("stop"),
    async query<T>(sql: string, values: unknown[] = []) {
      const conn = await mariadb.createConnection({
        host: "127.0.0.1",
        port,
        user: "cellarpact",
        password: "cellarpact-local",
        database: "cellarpact",
      });
      try {
        return (await conn.query(sql, values)) as T[];
      } finally {
        await conn.end();
      }
    },
  };
}

export interface AppProcess {
  url: string;
  child: ChildProcess;
  /** kill -9: the process gets no chance to finish a request or a transaction. */
  kill(): Promise<void>;
}

export async function startApp(env: Record<string, string>, port: number): Promise<{ app: AppProcess; readyMs: number }> {
  const started = performance.now();
  const child = spawn(process.execPath, ["--import", "tsx", "server/main.ts"], {
    cwd: root,
    env: { ...process.env, ...env, PORT: String(port), LOG_LEVEL: "error", JWT_SECRET: "fault-tests-secret-0123456789-abcdefghijklmnop" },
    stdio: ["ignore", "ignore", "inherit"],
  });
  const url = `http://127.0.0.1:${port}`;
  for (;;) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) break;
    } catch {
      /* not up yet */
    }
    if (child.exitCode !== null) throw new Error("the app exited while starting");
    await new Promise((r) => setTimeout(r, 50));
  }
  return {
    readyMs: performance.now() - started,
    app: {
      url,
      child,
      kill: async () => {
        if (child.exitCode !== null) return;
        const gone = new Promise((r) => child.once("exit", r));
        child.kill("SIGKILL");
        await gone;
      },
    },
  };
}

/** Signs in over HTTP as the browser does; answers the headers a later write needs. */
export async function signIn(url: string, email: string, password: string) {
  const res = await fetch(`${url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status}`);
  const body = (await res.json()) as { csrfToken: string; user: { memberships: { organisationId: number; role: string }[] } };
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return { headers: { cookie, "x-csrf-token": body.csrfToken, "content-type": "application/json" }, memberships: body.user.memberships };
}
