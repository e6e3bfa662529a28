import "server-only";
import PDFDocument from "pdfkit";
import type { Verdict } from "@/lib/domain";
import {
  BRASS,
  F,
  INK,
  MARGIN,
  MUTED,
  RULE,
  STEEL,
  VERDICT_COLOUR,
  type PageSize,
} from "@/lib/server/record/pdf-styles";

// A thin layer over pdfkit for the record: a cursor that moves down the page, breaks pages
// before a block that would not fit (a table row, a box, a heading with its first lines), and
// the few drawing pieces the record needs. Page furniture (header, footer, page numbers) is drawn
// once at the end, on the buffered pages, when the page count is known.

export type Piece = { text: string; font?: string; size?: number; colour?: string };
export type Block = Piece[] | { verdict: Verdict | null; words: string };
export type Column<T> = { title: string; width: number; cell: (row: T) => Block | string };

const isMark = (b: Block): b is { verdict: Verdict | null; words: string } => !Array.isArray(b);
const asBlock = (b: Block | string): Block => (typeof b === "string" ? [{ text: b }] : b);

export class Canvas {
  readonly doc: PDFKit.PDFDocument;
  readonly left: number;
  readonly width: number;
  private readonly bottom: number;
  y: number;

  constructor(size: PageSize, info: { Title: string; Author: string; Subject: string; CreationDate: Date }) {
    this.doc = new PDFDocument({
      size: size === "A4" ? "A4" : "LETTER",
      margins: { top: MARGIN.top, bottom: 0, left: MARGIN.side, right: MARGIN.side },
      bufferPages: true,
      info: { ...info, Creator: "Tenthwise", Producer: "Tenthwise" },
    });
    this.left = MARGIN.side;
    this.width = this.doc.page.width - 2 * MARGIN.side;
    this.bottom = this.doc.page.height - MARGIN.bottom;
    this.y = MARGIN.top;
  }

  /** Starts a new page when `height` does not fit below the cursor. */
  ensure(height: number): void {
    if (this.y + height <= this.bottom) return;
    this.doc.addPage();
    this.y = MARGIN.top;
  }

  private style(p: Piece) {
    return this.doc
      .font(p.font ?? F.regular)
      .fontSize(p.size ?? F.body)
      .fillColor(p.colour ?? INK);
  }

  /** Wrapping text is most of the work: each piece is measured once, then drawn with that height. */
  private readonly heights = new Map<string, number>();

  private pieceHeight(p: Piece, width: number): number {
    const key = `${p.font ?? F.regular}|${p.size ?? F.body}|${width}|${p.text}`;
    let h = this.heights.get(key);
    if (h === undefined) {
      h = this.style(p).heightOfString(p.text || " ", { width, lineGap: 1 });
      this.heights.set(key, h);
    }
    return h;
  }

  textHeight(pieces: Piece[], width: number): number {
    return pieces.reduce((h, p) => h + this.pieceHeight(p, width), 0);
  }

  /** Draws pieces one under the other at (x, y) without moving the cursor; returns their height. */
  drawPieces(pieces: Piece[], x: number, y: number, width: number): number {
    let at = y;
    for (const p of pieces) {
      const h = this.pieceHeight(p, width);
      if (p.text) this.style(p).text(p.text, x, at, { width, lineGap: 1 });
      at += h;
    }
    return at - y;
  }

  /** Pieces at the cursor, kept together on one page. */
  text(pieces: Piece[] | string, gapAfter = 2): void {
    const ps = typeof pieces === "string" ? [{ text: pieces }] : pieces;
    const h = this.textHeight(ps, this.width);
    this.ensure(h);
    this.drawPieces(ps, this.left, this.y, this.width);
    this.y += h + gapAfter;
  }

  /** A section heading with a rule under it, never left alone at the foot of a page. */
  heading(title: string, keepWith = 70): void {
    this.ensure(30 + keepWith);
    this.y += 12;
    this.style({ text: title, font: F.bold, size: 12, colour: STEEL }).text(title, this.left, this.y, {
      width: this.width,
    });
    this.y += 15;
    this.doc
      .moveTo(this.left, this.y)
      .lineTo(this.left + this.width, this.y)
      .lineWidth(1.5)
      .strokeColor(STEEL)
      .stroke();
    this.y += 5;
  }

  subHeading(title: string): void {
    this.ensure(60);
    this.y += 5;
    this.text([{ text: title, font: F.bold, size: 9.5 }], 3);
  }

  /** A framed block: plain (rule), release (steel), void (red) or caution (brass bar at left). */
  box(pieces: Piece[], kind: "plain" | "release" | "void" | "caution" = "plain", x = this.left, w = this.width) {
    const pad = kind === "release" || kind === "void" ? 10 : 8;
    const inner = w - 2 * pad - (kind === "caution" ? 5 : 0);
    const h = this.textHeight(pieces, inner) + 2 * pad;
    this.ensure(h + 6);
    const line = { plain: [1, RULE], release: [2, STEEL], void: [3, VERDICT_COLOUR.out_of_spec], caution: [1.5, INK] };
    const [lw, colour] = line[kind] as [number, string];
    this.doc.rect(x, this.y, w, h).lineWidth(lw).strokeColor(colour).stroke();
    if (kind === "caution") this.doc.rect(x, this.y, 6, h).fillColor(BRASS).fill();
    this.drawPieces(pieces, x + pad + (kind === "caution" ? 5 : 0), this.y + pad, inner);
    return h;
  }

  /** The app's verdict shapes: a round dot in spec, a diamond marginal, a crossed square out. */
  verdictShape(verdict: Verdict, x: number, y: number, size = 7): void {
    const d = this.doc;
    const c = VERDICT_COLOUR[verdict];
    const k = size / 16;
    d.save().translate(x, y).scale(k);
    if (verdict === "in_spec") d.circle(8, 8, 6.5).fillColor(c).fill();
    else if (verdict === "marginal") d.polygon([8, 0.8], [15.2, 8], [8, 15.2], [0.8, 8]).fillColor(c).fill();
    else {
      d.rect(1, 1, 14, 14).fillColor(c).fill();
      d.moveTo(4.5, 4.5).lineTo(11.5, 11.5).moveTo(11.5, 4.5).lineTo(4.5, 11.5);
      d.lineWidth(2.4).strokeColor("#ffffff").stroke();
    }
    d.restore();
  }

  private markPieces(m: { verdict: Verdict | null; words: string }): Piece[] {
    if (!m.verdict) return [{ text: m.words, colour: MUTED, size: F.table }];
    return [{ text: m.words.toUpperCase(), font: F.bold, colour: VERDICT_COLOUR[m.verdict], size: F.table }];
  }

  blockHeight(b: Block, width: number): number {
    return isMark(b) ? this.textHeight(this.markPieces(b), width - 10) : this.textHeight(b, width);
  }

  drawBlock(b: Block, x: number, y: number, width: number): void {
    if (!isMark(b)) return void this.drawPieces(b, x, y, width);
    if (!b.verdict) return void this.drawPieces(this.markPieces(b), x, y, width);
    this.verdictShape(b.verdict, x, y + 1);
    this.drawPieces(this.markPieces(b), x + 10, y, width - 10);
  }

  private tableHeader<T>(columns: Column<T>[]): void {
    let x = this.left;
    this.rule(this.y, 0.75, INK);
    for (const c of columns) {
      const w = (c.width / 100) * this.width;
      this.style({ text: c.title, font: F.bold, size: F.table }).text(c.title, x, this.y + 2, { width: w - 4 });
      x += w;
    }
    this.y += 13;
    this.rule(this.y, 0.75, INK);
    this.y += 2;
  }

  private rule(y: number, lw: number, colour: string) {
    this.doc
      .moveTo(this.left, y)
      .lineTo(this.left + this.width, y)
      .lineWidth(lw)
      .strokeColor(colour)
      .stroke();
  }

  /** Rows never split across pages; the header repeats on every page the table reaches. */
  table<T>(columns: Column<T>[], rows: T[], note?: (row: T) => string): void {
    const widths = columns.map((c) => (c.width / 100) * this.width);
    this.ensure(40);
    this.tableHeader(columns);
    for (const row of rows) {
      const cells = columns.map((c) => asBlock(c.cell(row)));
      const noteText = note?.(row) ?? "";
      const notePieces: Piece[] = [{ text: noteText, font: F.italic, size: 7, colour: MUTED }];
      const cellsH = Math.max(...cells.map((b, i) => this.blockHeight(b, widths[i] - 4)));
      const h = cellsH + (noteText ? this.textHeight(notePieces, this.width) + 1 : 0) + 4;
      if (this.y + h > this.bottom) {
        this.ensure(h + 20);
        this.tableHeader(columns);
      }
      let x = this.left;
      cells.forEach((b, i) => {
        this.drawBlock(b, x, this.y + 2, widths[i] - 4);
        x += widths[i];
      });
      if (noteText) this.drawPieces(notePieces, this.left, this.y + 3 + cellsH, this.width);
      this.y += h;
      this.rule(this.y, 0.5, RULE);
    }
    this.y += 6;
  }
}
