/** The few config values that services need, set once when the app is built. */
export interface ServiceSettings {
  appUrl: string;
  bcryptCost: number;
  certificateDir: string;
}

let current: ServiceSettings | null = null;

export function useServiceSettings(s: ServiceSettings): void {
  current = s;
}

export function serviceSettings(): ServiceSettings {
  if (!current) throw new Error("service settings not initialised");
  return current;
}
