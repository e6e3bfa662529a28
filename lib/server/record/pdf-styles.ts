import "server-only";
import { Font, StyleSheet } from "@react-pdf/renderer";

// The record's look: Helvetica (built into every PDF reader; react-pdf cannot embed the app's
// WOFF2 fonts), ink on white, thin rules, and verdict colours dark enough to print as distinct
// greys. Every verdict also carries its word and shape, so colour is never needed to read it.
// Words are never split with a hyphen: a station name or a link must read exactly as written.
Font.registerHyphenationCallback((word) => [word]);

export const INK = "#141b26";
export const MUTED = "#4a5463";
export const RULE = "#c4c8cf";
export const STEEL = "#1c4070";
export const BRASS = "#b07814";
export const VERDICT_COLOUR = { in_spec: "#0e6e4e", marginal: "#965c00", out_of_spec: "#b21e2c" } as const;

const PAGE_HEIGHT = { LETTER: 792, A4: 841.89 } as const;
export const footerTop = (size: keyof typeof PAGE_HEIGHT) => ({ top: PAGE_HEIGHT[size] - 32 });

export const s = StyleSheet.create({
  page: {
    paddingTop: 54,
    paddingBottom: 48,
    paddingHorizontal: 36,
    fontFamily: "Helvetica",
    fontSize: 8.5,
    color: INK,
    lineHeight: 1.3,
  },
  header: {
    position: "absolute",
    top: 20,
    left: 36,
    right: 36,
    flexDirection: "row",
    justifyContent: "space-between",
    borderBottomWidth: 0.75,
    borderBottomColor: RULE,
    paddingBottom: 4,
    fontSize: 7.5,
    color: MUTED,
  },
  footer: {
    position: "absolute",
    left: 36,
    right: 36,
    borderTopWidth: 0.75,
    borderTopColor: RULE,
    paddingTop: 4,
    fontSize: 7,
    color: MUTED,
  },
  // Footer lines are placed from the top (footerTop): a fixed element placed from the bottom, or
  // given a height, drifts page by page in react-pdf 4 until the number is lost or pdfkit throws.
  pageNumber: {
    position: "absolute",
    left: 36,
    right: 36,
    paddingTop: 4,
    textAlign: "right",
    fontSize: 7,
    color: MUTED,
  },
  watermark: {
    position: "absolute",
    top: 300,
    left: 0,
    right: 0,
    textAlign: "center",
    fontSize: 120,
    lineHeight: 1,
    fontFamily: "Helvetica-Bold",
    color: "#b21e2c",
    opacity: 0.13,
    transform: "rotate(-30deg)",
  },
  title: { fontSize: 22, lineHeight: 1.15, fontFamily: "Helvetica-Bold", color: STEEL },
  subtitle: { fontSize: 12, lineHeight: 1.2, marginTop: 2, marginBottom: 10 },
  h2: {
    fontSize: 12,
    lineHeight: 1.2,
    fontFamily: "Helvetica-Bold",
    color: STEEL,
    marginTop: 14,
    marginBottom: 5,
    paddingBottom: 2,
    borderBottomWidth: 1.5,
    borderBottomColor: STEEL,
  },
  h3: { fontSize: 9.5, fontFamily: "Helvetica-Bold", marginTop: 8, marginBottom: 3 },
  muted: { color: MUTED },
  small: { fontSize: 7.5 },
  bold: { fontFamily: "Helvetica-Bold" },
  mono: { fontFamily: "Courier", fontSize: 8 },
  row2: { flexDirection: "row", gap: 12 },
  col: { flex: 1 },
  box: { borderWidth: 1, borderColor: RULE, padding: 8, marginBottom: 8 },
  releaseBox: { borderWidth: 2, borderColor: STEEL, padding: 10, marginBottom: 10 },
  voidBox: { borderWidth: 3, borderColor: "#b21e2c", padding: 10, marginBottom: 10 },
  caution: {
    borderWidth: 1.5,
    borderColor: INK,
    borderLeftWidth: 6,
    borderLeftColor: BRASS,
    padding: 8,
    marginTop: 6,
    marginBottom: 6,
  },
  kv: { flexDirection: "row", marginBottom: 1.5 },
  kvLabel: { width: "32%", color: MUTED },
  kvValue: { width: "68%" },
  table: { borderTopWidth: 0.75, borderTopColor: INK, marginBottom: 6 },
  th: {
    flexDirection: "row",
    borderBottomWidth: 0.75,
    borderBottomColor: INK,
    paddingVertical: 2,
    fontFamily: "Helvetica-Bold",
    fontSize: 7.5,
  },
  tr: { borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 2, fontSize: 7.5 },
  trCells: { flexDirection: "row" },
  trNote: { fontSize: 7, color: MUTED, fontFamily: "Helvetica-Oblique", paddingTop: 1 },
  cell: { paddingRight: 4 },
  verdict: { flexDirection: "row", alignItems: "center", gap: 3 },
  photoGrid: { flexDirection: "row", flexWrap: "wrap", gap: 8 },
  photo: { width: 124, marginBottom: 6 },
  photoImg: {
    width: 124,
    height: 93,
    objectFit: "contain",
    backgroundColor: "#f0f0ee",
    borderWidth: 0.5,
    borderColor: RULE,
  },
  signLine: {
    borderBottomWidth: 1,
    borderBottomColor: INK,
    paddingBottom: 2,
    marginTop: 10,
    fontFamily: "Helvetica-Oblique",
    fontSize: 16,
    lineHeight: 1.2,
  },
});
