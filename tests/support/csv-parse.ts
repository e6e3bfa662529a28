/** A strict RFC 4180 reader (section 2 grammar): fields, quoted fields with "" for a quote, CRLF records. */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let i = 0;
  while (i < text.length) {
    let field = "";
    if (text[i] === '"') {
      i += 1;
      for (;;) {
        if (i >= text.length) throw new Error("unterminated quoted field");
        if (text[i] === '"' && text[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        if (text[i] === '"') {
          i += 1;
          break;
        }
        field += text[i++];
      }
    } else {
      while (i < text.length && text[i] !== "," && text[i] !== "\r") {
        if (text[i] === '"' || text[i] === "\n") throw new Error(`bare ${JSON.stringify(text[i])} at ${i}`);
        field += text[i++];
      }
    }
    row.push(field);
    if (text[i] === ",") {
      i += 1;
      continue;
    }
    if (text.slice(i, i + 2) !== "\r\n") throw new Error(`expected CRLF at ${i}`);
    i += 2;
    rows.push(row);
    row = [];
  }
  return rows;
}
