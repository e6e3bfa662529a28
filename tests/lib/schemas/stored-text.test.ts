import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { canonicalText, unstorableTextProblem } from "@/lib/schemas/canonical-text";
import { storedText } from "@/lib/schemas/stored-text";

const note = storedText("The note").max(5, "Keep the note to 5 characters");
const refusal = (input: unknown) => note.safeParse(input).error?.issues.map((i) => i.message);

describe("stored text: the canonical form", () => {
  it("composes to NFC", () => {
    // Unicode Standard Annex #15 (Unicode Normalization Forms), NFC: e + U+0301 COMBINING ACUTE
    // ACCENT composes to U+00E9 LATIN SMALL LETTER E WITH ACUTE.
    expect(canonicalText("e\u0301")).toBe("\u00e9");
    expect(note.parse("Cafe\u0301")).toBe("Caf\u00e9");
    // UAX #15: the Hangul jamo sequence U+1100 U+1161 composes to the syllable U+AC00.
    expect(canonicalText("\u1100\u1161")).toBe("\uac00");
    // UAX #15: a singleton decomposition, U+212B ANGSTROM SIGN, becomes U+00C5 under NFC.
    expect(canonicalText("\u212b")).toBe("\u00c5");
  });

  it("checks the length of the text as stored: 5 composed characters fit in 5", () => {
    expect(note.parse("e\u0301e\u0301e\u0301e\u0301e\u0301")).toBe("\u00e9".repeat(5));
  });

  it("makes every line end LF and keeps tabs and line feeds", () => {
    expect(canonicalText("a\r\nb\rc\nd\te")).toBe("a\nb\nc\nd\te");
    expect(unstorableTextProblem("a\r\nb\tc", "The note")).toBeUndefined();
  });

  it("keeps characters outside the basic plane whole (a surrogate pair is one character)", () => {
    expect(note.parse("ok \u{1F527}")).toBe("ok \u{1F527}");
  });
});

describe("stored text: what is refused, in words", () => {
  it("refuses a lone surrogate and says where it is", () => {
    expect(refusal("ab\ud800")).toEqual([
      "The note holds half of a character (U+D800) at character 3; delete it and type that character again",
    ]);
    expect(refusal("\udc00")).toEqual([expect.stringContaining("(U+DC00) at character 1")]);
    // A high surrogate followed by another high one is still half a character.
    expect(refusal("\ud83d\ud83d\ude00")).toEqual([expect.stringContaining("(U+D83D) at character 1")]);
  });

  it("refuses NUL and the other control characters, and only one message per field", () => {
    for (const c of ["\u0000", "\u0001", "\u0008", "\u000b", "\u000c", "\u001b", "\u007f", "\u0085", "\u009f"]) {
      const words = refusal(`abcdefgh${c}`);
      expect(words).toHaveLength(1);
      expect(words?.[0]).toMatch(/^The note holds an invisible control character \(U\+00[0-9A-F]{2}\) at character 9/);
    }
  });

  it("counts the position in characters, a character outside the basic plane as one", () => {
    expect(unstorableTextProblem("\u{1F527}\u0000", "Name")).toContain("at character 2");
  });

  it("says what to give when the input is not text", () => {
    expect(storedText("The note").safeParse(5).error?.issues[0].message).toBe("The note must be text");
    expect(storedText("x", "Enter a name").safeParse(null).error?.issues[0].message).toBe("Enter a name");
  });
});

describe("stored text: properties", () => {
  const anyText = fc.string({ unit: "binary", maxLength: 40 });

  it("accepts exactly the text without lone surrogates or control characters other than tab and line ends", () => {
    fc.assert(
      fc.property(anyText, (text) => {
        const lines = text.replace(/\r\n?/g, "\n");
        const storable =
          lines.isWellFormed() && [...lines].every((ch) => !/\p{Cc}/u.test(ch) || ch === "\t" || ch === "\n");
        expect(storedText("T").safeParse(text).success).toBe(storable);
      }),
      { seed: 12, numRuns: 500 },
    );
  });

  it("is idempotent: the stored form of stored text is itself", () => {
    fc.assert(
      fc.property(anyText, (text) => {
        const once = storedText("T").safeParse(text);
        if (once.success) expect(storedText("T").parse(once.data)).toBe(once.data);
      }),
      { seed: 12, numRuns: 500 },
    );
  });
});
