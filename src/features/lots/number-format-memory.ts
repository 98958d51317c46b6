/** Each laboratory's number format, remembered in this browser once someone has said it for one of its files. */
import type { NumberFormat } from "../../../shared/engine/index.ts";

const KEY = "cellarpact.lab-number-formats";
const norm = (lab: string) => lab.trim().toLowerCase();

function all(): Record<string, NumberFormat> {
  try {
    return JSON.parse(localStorage.getItem(KEY) ?? "{}") as Record<string, NumberFormat>;
  } catch {
    return {};
  }
}

export const rememberedFormat = (lab: string): NumberFormat | undefined => all()[norm(lab)];

export function rememberFormat(lab: string, format: NumberFormat): void {
  localStorage.setItem(KEY, JSON.stringify({ ...all(), [norm(lab)]: format }));
}
