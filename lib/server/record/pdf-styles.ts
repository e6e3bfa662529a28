import "server-only";

// The record's look: Helvetica (built into every PDF reader, nothing to embed), ink on white, thin
// rules, and verdict colours dark enough to print as distinct greys. Every verdict also carries its
// word and shape, so colour is never needed to read it. Words are never hyphenated: a station name
// or a link must read exactly as written.

export const INK = "#141b26";
export const MUTED = "#4a5463";
export const RULE = "#c4c8cf";
export const STEEL = "#1c4070";
export const BRASS = "#b07814";
export const VOID_RED = "#b21e2c";
export const VERDICT_COLOUR = { in_spec: "#0e6e4e", marginal: "#965c00", out_of_spec: "#b21e2c" } as const;

export type PageSize = "LETTER" | "A4";

/** Margins in points: the header sits in the top one, the footer and page number in the bottom one. */
export const MARGIN = { top: 54, bottom: 48, side: 36 } as const;

/** Font names (the 14 standard PDF fonts) and the sizes of body and table text. */
export const F = {
  regular: "Helvetica",
  bold: "Helvetica-Bold",
  italic: "Helvetica-Oblique",
  mono: "Courier",
  body: 8.5,
  table: 7.5,
  small: 7.5,
} as const;
