/** The few config values that services need, set once when the app is built (or a seeder runs). */
import path from "node:path";
import type { Config } from "./config.ts";

export interface ServiceSettings {
  appUrl: string;
  bcryptCost: number;
  certificateDir: string;
  /** The Ed25519 key that signs the trail's tree heads: a PEM file outside the database, made on first use. */
  trailSigningKeyFile: string;
  /** Failed sign-ins a subject may make before each further one doubles its wait (server/services/sign-in-throttle.ts). */
  signInFreeFailures: number;
  /** Where the stripe SDK sends its requests (a local fake outside production) and the webhook signing secret. */
  stripe: { secretKey: string; webhookSecret: string; host: string; port: number; protocol: "http" | "https" };
}

let current: ServiceSettings | null = null;

export function settingsFrom(config: Config): ServiceSettings {
  return {
    appUrl: config.APP_URL,
    bcryptCost: config.BCRYPT_COST,
    certificateDir: path.resolve(config.CERTIFICATE_DIR),
    signInFreeFailures: config.LOGIN_LIMIT_PER_ACCOUNT,
    trailSigningKeyFile: path.resolve(config.TRAIL_SIGNING_KEY_FILE),
    stripe: {
      secretKey: config.STRIPE_SECRET_KEY,
      webhookSecret: config.STRIPE_WEBHOOK_SECRET,
      host: config.STRIPE_API_HOST,
      port: config.STRIPE_API_PORT,
      protocol: config.STRIPE_API_PROTOCOL,
    },
  };
}

export function useServiceSettings(s: ServiceSettings): void {
  current = s;
}

export function serviceSettings(): ServiceSettings {
  if (!current) throw new Error("service settings not initialised");
  return current;
}
