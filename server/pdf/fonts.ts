/**
 * Source Sans 3 for PDFs, embedded from @fontsource. Only .woff works with react-pdf's font engine
 * (.woff2 crashes when subsetting); latin and latin-ext are registered as two families because
 * each file covers only part of the alphabet. Source Sans's web subsets lack the mathematical signs
 * a spec prints (≤ ≥ →), so DejaVu Sans, which has them, is the last fallback.
 */
import { createRequire } from "node:module";
import { Font } from "@react-pdf/renderer";

const require = createRequire(import.meta.url);
const file = (subset: "latin" | "latin-ext", weight: 400 | 600) =>
  require.resolve(`@fontsource/source-sans-3/files/source-sans-3-${subset}-${weight}-normal.woff`);

const symbols = (weight: 400 | 700) => require.resolve(`@fontsource/dejavu-sans/files/dejavu-sans-latin-${weight}-normal.woff`);

let registered = false;
export function registerPdfFonts(): void {
  if (registered) return;
  Font.register({
    family: "Source Sans 3",
    fonts: [
      { src: file("latin", 400), fontWeight: 400 },
      { src: file("latin", 600), fontWeight: 600 },
    ],
  });
  Font.register({
    family: "Source Sans 3 Ext",
    fonts: [
      { src: file("latin-ext", 400), fontWeight: 400 },
      { src: file("latin-ext", 600), fontWeight: 600 },
    ],
  });
  Font.register({
    family: "DejaVu Sans",
    fonts: [
      { src: symbols(400), fontWeight: 400 },
      { src: symbols(700), fontWeight: 600 },
    ],
  });
  // Hyphenating lab terms ("dis-solved") does more harm than good in tables.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

export const PDF_FONT = ["Source Sans 3", "Source Sans 3 Ext", "DejaVu Sans"];
