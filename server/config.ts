/** Configuration read once at boot from the environment; a bad value stops the process with every bad key listed. */
import { z } from "zod";

const bool = z.enum(["true", "false", "1", "0"]).transform((v) => v === "true" || v === "1");
const DEV_SECRET = "cellarpact-development-secret-not-for-production-use";

const schema = z
  .object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
    HOST: z.string().default("127.0.0.1"),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    APP_URL: z.url().optional(),
    DB_HOST: z.string().default("127.0.0.1"),
    DB_PORT: z.coerce.number().int().min(1).max(65535).default(3407),
    DB_NAME: z
      .string()
      .regex(/^[A-Za-z0-9_]+$/)
      .default("cellarpact"),
    DB_USER: z.string().default("cellarpact"),
    DB_PASSWORD: z.string().default("cellarpact-local"),
    DB_POOL_MAX: z.coerce.number().int().min(1).max(50).default(5),
    JWT_SECRET: z.string().min(32).default(DEV_SECRET),
    SESSION_HOURS: z.coerce
      .number()
      .positive()
      .max(24 * 7)
      .default(8),
    COOKIE_SECURE: bool.default(false),
    BCRYPT_COST: z.coerce.number().int().min(4).max(15).optional(),
    SMTP_HOST: z.string().default("127.0.0.1"),
    SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
    MAIL_FROM: z.string().default("Cellarpact <no-reply@cellarpact.test>"),
    OUTBOX_POLL_MS: z.coerce.number().int().min(10).default(1000),
    OUTBOX_RETRY_BASE_MS: z.coerce.number().int().min(10).default(2000),
    OUTBOX_MAX_ATTEMPTS: z.coerce.number().int().min(1).default(12),
    LOGIN_LIMIT_PER_IP: z.coerce.number().int().min(1).default(30),
    LOGIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).default(8),
    LOGIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
    CLIENT_DIR: z.string().optional(),
    // The longest an API request may take before it is answered 503 (see server/http/request-budget.ts).
    REQUEST_BUDGET_MS: z.coerce.number().int().min(1).max(600_000).default(30_000),
    // New requests are refused 503 while the heap is above this share of its limit, and no JSON answer may pass
    // ANSWER_BUDGET_BYTES (see server/http/memory-budget.ts).
    HEAP_BUDGET_FRACTION: z.coerce.number().gt(0).max(1).default(0.85),
    ANSWER_BUDGET_BYTES: z.coerce
      .number()
      .int()
      .min(1024)
      .default(32 * 1024 * 1024),
    // The key that signs the trail's tree heads lives in a file, not in the database it vouches for.
    TRAIL_SIGNING_KEY_FILE: z.string().default(".data/trail-signing-key.pem"),
    // Outside the web root: certificates are only ever served by the download route.
    CERTIFICATE_DIR: z.string().default(".data/certificates"),
    CERTIFICATE_MAX_BYTES: z.coerce
      .number()
      .int()
      .min(1024)
      .max(100 * 1024 * 1024)
      .default(10 * 1024 * 1024),
    // Payments go through the stripe SDK; outside production it talks to the local fake (server/fakes/stripe).
    STRIPE_SECRET_KEY: z
      .string()
      .regex(/^sk_(test|live)_\w+$/, { error: "a Stripe secret key starts with sk_test_ or sk_live_" })
      .default("sk_test_cellarpact_local"),
    STRIPE_WEBHOOK_SECRET: z.string().min(16).default("whsec_cellarpact_local_development"),
    STRIPE_API_HOST: z.string().default("127.0.0.1"),
    STRIPE_API_PORT: z.coerce.number().int().min(1).max(65535).default(12111),
    STRIPE_API_PROTOCOL: z.enum(["http", "https"]).default("http"),
    LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  })
  .superRefine((c, ctx) => {
    if (c.NODE_ENV === "production" && c.JWT_SECRET === DEV_SECRET) {
      ctx.addIssue({ code: "custom", path: ["JWT_SECRET"], message: "set a secret of your own in production" });
    }
  });

export type Config = z.infer<typeof schema> & { APP_URL: string; BCRYPT_COST: number };

export class ConfigError extends Error {}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join("\n")}`);
  }
  const c = parsed.data;
  return {
    ...c,
    APP_URL: c.APP_URL ?? `http://${c.HOST}:${c.PORT}`,
    BCRYPT_COST: c.BCRYPT_COST ?? (c.NODE_ENV === "production" ? 12 : 10),
  };
}
