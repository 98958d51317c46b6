/**
 * Every character a Cellarpact PDF prints must come out as itself: the signs of limits and
 * uncertainties (≤ ≥ ±), units (µ ° ‰), dashes and separators (– ·), arrows and accented names.
 * Read back with poppler's pdftotext; pdffonts must list only embedded fonts (a missing glyph
 * otherwise falls back to an unembedded Helvetica and prints as something else).
 */
import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { createElement as h } from "react";
import { Document, Page, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { registerPdfFonts } from "../../server/pdf/fonts.ts";
import { base } from "../../server/pdf/styles.ts";

const SIGNS = "≤ ≥ ± µ ° ‰ – · → é è ü ß ć ő";

describe("PDF glyphs", () => {
  it("when a PDF prints limit signs, units and accented names in both weights, then pdftotext reads each back and every font is embedded", async () => {
    registerPdfFonts();
    const doc = h(
      Document,
      null,
      h(Page, { size: "A4", style: base.page }, h(View, null, h(Text, null, SIGNS), h(Text, { style: { fontWeight: 600 } }, SIGNS))),
    );
    const pdf = await renderToBuffer(doc);
    const text = execFileSync("pdftotext", ["-", "-"], { input: pdf, encoding: "utf8" });
    // pdftotext may drop the spaces where the font changes; the characters themselves must all be there.
    const squash = (x: string) => x.replace(/\s+/g, "");
    expect(squash(text)).toBe(squash(SIGNS + SIGNS));
    const fonts = execFileSync("pdffonts", ["-"], { input: pdf, encoding: "utf8" }).split("\n").slice(2).filter(Boolean);
    expect(fonts.length).toBeGreaterThan(0);
    for (const line of fonts) expect([line, line.split(/\s+/).at(-5)]).toEqual([line, "yes"]);
  });
});
