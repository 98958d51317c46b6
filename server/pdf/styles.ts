/** The look every Cellarpact PDF shares: A4, Source Sans 3, the brand line, headings, table rows, footer. */
import { StyleSheet } from "@react-pdf/renderer";
import { PDF_FONT } from "./fonts.ts";

export const base = StyleSheet.create({
  page: { fontFamily: PDF_FONT as unknown as string, fontSize: 9.5, color: "#1b2230", padding: 40, paddingBottom: 56 },
  brand: { fontSize: 10, fontWeight: 600, color: "#5b1f3c" },
  h1: { fontSize: 17, fontWeight: 600, marginTop: 4, marginBottom: 8 },
  h2: { fontSize: 12, fontWeight: 600, marginTop: 14, marginBottom: 4 },
  row: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: "#ddd6ca", paddingVertical: 3 },
  head: { flexDirection: "row", borderBottomWidth: 1, borderBottomColor: "#1b2230", paddingVertical: 3, fontWeight: 600 },
  small: { fontSize: 8, color: "#5c6470" },
  box: { borderWidth: 1, borderColor: "#5b1f3c", padding: 8, marginTop: 8 },
  footer: {
    position: "absolute",
    bottom: 24,
    left: 40,
    right: 40,
    fontSize: 7.5,
    color: "#5c6470",
    flexDirection: "row",
    justifyContent: "space-between",
  },
});

export const stamp = (d: Date | string) => (typeof d === "string" ? d : d.toISOString()).slice(0, 16).replace("T", " ") + " UTC";
