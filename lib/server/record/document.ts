import "server-only";
import { COMMON_PRACTICE_WORDS, verdictInText } from "@/lib/domain";
import { plural } from "@/lib/server/record/format";
import { bearingSection } from "@/lib/server/record/pdf-bearings";
import { Canvas, type Piece } from "@/lib/server/record/pdf-canvas";
import {
  keyValues,
  photosSection,
  planSection,
  readingsSection,
  reviewSections,
  torqueSection,
} from "@/lib/server/record/pdf-sections";
import { F, INK, MARGIN, MUTED, RULE, STEEL, VERDICT_COLOUR, VOID_RED } from "@/lib/server/record/pdf-styles";
import type { BuildRecord } from "@/lib/schemas/record";

// The build record as a PDF document (our own layout), drawn with pdfkit. Page one carries who,
// what, the release stamp with its fingerprint, the tally and the safety notice; the detail follows.

export function stateWords(r: BuildRecord): { mark: string; words: string } {
  if (!r.release)
    return {
      mark: "DRAFT",
      words: "DRAFT: NOT RELEASED. This job has not been signed off by an inspector; figures may still change.",
    };
  if (r.release.status === "void")
    return {
      mark: "VOID",
      words:
        `VOID: this release was withdrawn on ${r.release.voidedAt}` +
        `${r.release.voidedByName ? ` by ${r.release.voidedByName}` : ""}. ` +
        `Reason: ${r.release.voidReason ?? "none given"}. Do not assemble from this record. ` +
        "When the job is released again, the shop sends a new record.",
    };
  return { mark: "", words: "RELEASED FOR ASSEMBLY" };
}

function releaseBox(c: Canvas, record: BuildRecord): void {
  const r = record.release;
  const standing = r?.status === "standing";
  const pieces: Piece[] = [{ text: stateWords(record).words, font: F.bold, size: standing ? 13 : 11 }];
  if (r)
    pieces.push(
      { text: `Signed by ${r.inspectorName}, inspector, on ${r.signedAt}.` },
      { text: "Fingerprint (SHA-256 of the released readings, limits, decisions and gauges):" },
      { text: r.hash, font: F.mono, size: 8 },
      { text: `Check when this copy was made: ${r.check.words}`, size: F.small },
      { text: `Anyone can check it again at ${r.verifyUrl}`, size: F.small, colour: MUTED },
    );
  c.y += c.box(pieces, standing ? "release" : "void") + 10;
}

function tally(c: Canvas, record: BuildRecord): void {
  const t = record.tally;
  const summary =
    `${plural(t.measured, "station")} measured${t.skipped ? `, ${t.skipped} skipped` : ""}` +
    `${t.unjudged ? `, ${t.unjudged} with no limit` : ""}; ${plural(record.derived.length, "value")} computed; ` +
    `${plural(record.flags.length, "flag")}.`;
  const h = c.box([{ text: summary, font: F.bold }, { text: " " }], "plain");
  const items = [
    { verdict: "in_spec" as const, words: `${t.inSpec} ${verdictInText("in_spec")}` },
    { verdict: "marginal" as const, words: `${t.marginal} ${verdictInText("marginal")}` },
    { verdict: "out_of_spec" as const, words: `${t.outOfSpec} ${verdictInText("out_of_spec")} (see decisions)` },
  ];
  let x = c.left + 8;
  const y = c.y + h - 8 - 11;
  for (const i of items) {
    c.verdictShape(i.verdict, x, y + 1, 9);
    c.drawPieces([{ text: i.words, colour: VERDICT_COLOUR[i.verdict] }], x + 12, y, 200);
    x += 24 + c.doc.widthOfString(i.words);
  }
  c.y += h + 8;
}

function cover(c: Canvas, record: BuildRecord): void {
  c.text([{ text: "Build record", font: F.bold, size: 22, colour: STEEL }], 2);
  c.text([{ text: `${record.job.code} · ${record.job.title}`, size: 12 }], 10);
  releaseBox(c, record);
  const half = (c.width - 12) / 2;
  const party = (title: string, p: { name: string; contact: string[] }): Piece[] => [
    { text: title, font: F.bold },
    { text: p.name || " " },
    ...p.contact.map((text) => ({ text })),
  ];
  const top = c.y;
  const h1 = c.box(party("Shop", record.shop), "plain", c.left, half);
  c.y = top;
  const h2 = c.box(party("Customer", record.customer), "plain", c.left + half + 12, half);
  c.y = top + Math.max(h1, h2) + 8;
  const lines = [
    ...record.engine,
    { label: "Units", value: record.job.units },
    { label: "Spec sheet revision", value: String(record.job.specRevision) },
  ];
  c.ensure(lines.length * 12);
  c.y += keyValues(c, lines, c.left, c.width) + 6;
  tally(c, record);
  if (record.commonPractice.length > 0) {
    const words = `${COMMON_PRACTICE_WORDS}: ${record.commonPractice.join("; ")}.`;
    c.y += c.box([{ text: "LIMITS AT TYPICAL FIGURES", font: F.bold }, { text: words }], "caution") + 8;
  }
  const safety = record.safety.map((text) => ({ text }));
  c.y += c.box([{ text: "SAFETY NOTICE", font: F.bold }, ...safety], "caution") + 8;
}

function signature(c: Canvas, record: BuildRecord): void {
  const r = record.release;
  c.heading("Release", 80);
  if (!r) return c.text("Not released: no inspector has signed this record.");
  c.y += 10;
  c.text([{ text: r.inspectorName, font: F.italic, size: 16 }], 2);
  c.doc
    .moveTo(c.left, c.y)
    .lineTo(c.left + c.width, c.y)
    .lineWidth(1)
    .strokeColor(INK)
    .stroke();
  c.y += 3;
  const voided = r.status === "void" ? " THIS RELEASE IS VOID." : "";
  c.text(`E-signature of ${r.inspectorName}, inspector, given with their password on ${r.signedAt}.${voided}`, 3);
  c.text([{ text: `SHA-256 ${r.hash} (record format v${r.canonicalVersion})`, font: F.mono, size: 8 }]);
  for (const e of record.earlierReleases) {
    const state =
      e.status === "void" ? `VOID since ${e.voidedAt}. Reason: ${e.voidReason ?? "none given"}` : "standing";
    c.text([{ text: `Earlier release signed by ${e.inspectorName} on ${e.signedAt}: ${state}.`, size: F.small }]);
  }
}

/** Header, watermark, footer and "Page n of N" on every page, once the page count is known. */
function furniture(c: Canvas, record: BuildRecord): void {
  const { mark } = stateWords(record);
  const fingerprint = record.release ? `fingerprint ${record.release.hash.slice(0, 16)}…` : "not released";
  const d = c.doc;
  const range = d.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    d.switchToPage(range.start + i);
    const { width, height } = d.page;
    const small = (text: string, x: number, y: number, align: "left" | "right") =>
      d.font(F.regular).fontSize(7).fillColor(MUTED).text(text, x, y, { width: c.width, align, lineBreak: false });
    small(`Tenthwise build record · ${record.job.code}${mark ? ` · ${mark}` : ""}`, c.left, 20, "left");
    small(record.shop.name, c.left, 20, "right");
    d.moveTo(c.left, 31)
      .lineTo(width - MARGIN.side, 31)
      .lineWidth(0.75)
      .strokeColor(RULE)
      .stroke();
    d.moveTo(c.left, height - 32)
      .lineTo(width - MARGIN.side, height - 32)
      .stroke();
    small(`Made ${record.generatedAt} · ${fingerprint}`, c.left, height - 28, "left");
    small(`Page ${i + 1} of ${range.count}`, c.left, height - 28, "right");
    if (mark) {
      d.save()
        .rotate(-30, { origin: [width / 2, height / 2] })
        .fillOpacity(0.13);
      d.font(F.bold).fontSize(120).fillColor(VOID_RED);
      d.text(mark, 0, height / 2 - 60, { width, align: "center", lineBreak: false });
      d.restore();
    }
  }
}

/** The record as PDF bytes. */
export function drawRecord(record: BuildRecord, made: Date = new Date()): Promise<Buffer> {
  const c = new Canvas(record.pageSize, {
    Title: `Build record ${record.job.code}`,
    Author: record.shop.name,
    Subject: record.job.title,
    CreationDate: made,
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    c.doc.on("data", (b: Buffer) => chunks.push(b));
    c.doc.on("end", () => resolve(Buffer.concat(chunks)));
    c.doc.on("error", reject);
  });
  cover(c, record);
  planSection(c, record.plan);
  bearingSection(c, record.bearings);
  readingsSection(c, record);
  torqueSection(c, record.torque);
  reviewSections(c, record);
  photosSection(c, record);
  signature(c, record);
  furniture(c, record);
  c.doc.end();
  return done;
}
