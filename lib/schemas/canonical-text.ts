// The one canonical form of text the database keeps, decided where text comes in: every text
// field of every schema starts from `storedText` (stored-text.ts), so what is checked (lengths
// included) is what is stored, and a resent reading compares equal to its stored copy.
//   - line ends are LF: CRLF and a lone CR become LF;
//   - Unicode Normalization Form C (Unicode Standard Annex #15): "e" + combining acute is stored
//     as the one character "é", whichever way a keyboard or a paste produced it;
//   - refused, with words saying where: a lone UTF-16 surrogate (half of a character, which MariaDB
//     would keep as "?"), NUL and the other control characters (U+0001–U+001F, U+007F–U+009F),
//     except tab and line feed.
// No zod here: the tablet's entry sheets import it (the zod builder is in stored-text.ts).

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/;

/** Text in its stored form: LF line ends, then NFC. Leaves characters that cannot be stored in place. */
export function canonicalText(text: string): string {
  return text.replace(/\r\n?/g, "\n").normalize("NFC");
}

const codePoint = (unit: number) => `U+${unit.toString(16).toUpperCase().padStart(4, "0")}`;

/** Which character (1-based, counted as a person would) stands at UTF-16 offset `offset`. */
const position = (text: string, offset: number) => [...text.slice(0, offset)].length + 1;

/**
 * What makes `text` impossible to store, in words naming `what` and where, or undefined when it can
 * be stored. Checked on the canonical form, so a CR (a line end) is never refused.
 */
export function unstorableTextProblem(text: string, what: string): string | undefined {
  const lines = text.replace(/\r\n?/g, "\n");
  const half = LONE_SURROGATE.exec(lines);
  if (half) {
    const at = position(lines, half.index);
    return (
      `${what} holds half of a character (${codePoint(half[0].charCodeAt(0))}) at character ${at}; ` +
      "delete it and type that character again"
    );
  }
  const control = CONTROL.exec(lines);
  if (control) {
    const at = position(lines, control.index);
    return (
      `${what} holds an invisible control character (${codePoint(control[0].charCodeAt(0))}) ` +
      `at character ${at}, which cannot be stored; delete it (tabs and line breaks are fine)`
    );
  }
  return undefined;
}
