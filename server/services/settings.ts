/** The few config values that services need, set once when the app is built. */
export interface ServiceSettings {
  appUrl: string;
  bcryptCost: number;
  certificateDir: string;
  /** Where the stripe SDK sends its requests (a local fake outside production) and the webhook signing secret. */
  stripe: { secretKey: string; webhookSecret: string; host: string; port: number; protocol: "http" | "https" };
}

let current: ServiceSettings | null = null;

export function useServiceSettings(s: ServiceSettings): void {
  current = s;
}

export function serviceSettings(): ServiceSettings {
  if (!current) throw new Error("service settings not initialised");
  return current;
}
