// The text of a PDF (whitespace collapsed), read back with pdf-parse, for record and mail tests.
import { PDFParse } from "pdf-parse";

export async function pdfText(bytes: Buffer | Uint8Array): Promise<{ text: string; pages: number }> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    const out = await parser.getText();
    return { text: out.text.replace(/\s+/g, " "), pages: out.total };
  } finally {
    await parser.destroy();
  }
}
