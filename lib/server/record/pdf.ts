import "server-only";
import { loadBuildRecord } from "@/lib/server/record/data";
import { drawRecord } from "@/lib/server/record/document";
import type { BuildRecord } from "@/lib/schemas/record";

// The build record rendered to PDF bytes on the server, and the Response that carries it.
export async function renderRecordPdf(record: BuildRecord): Promise<Buffer> {
  return drawRecord(record);
}

export function fileNameFor(jobCode: string, state: "draft" | "void" | "standing"): string {
  const code = jobCode.replace(/[^A-Za-z0-9._-]+/g, "-");
  return `build-record-${code}${state === "standing" ? "" : `-${state}`}.pdf`;
}

export function recordFileName(record: Pick<BuildRecord, "job" | "release">): string {
  return fileNameFor(record.job.code, record.release?.status ?? "draft");
}

export async function buildRecordPdf(shopId: number, jobId: number, opts: { releaseId?: number } = {}) {
  const record = await loadBuildRecord(shopId, jobId, opts);
  return { record, pdf: await renderRecordPdf(record), fileName: recordFileName(record) };
}

export function pdfResponse(pdf: Buffer, fileName: string, disposition: "inline" | "attachment" = "inline"): Response {
  return new Response(new Uint8Array(pdf), {
    status: 200,
    headers: {
      "content-type": "application/pdf",
      "content-length": String(pdf.length),
      "content-disposition": `${disposition}; filename="${fileName}"`,
      "cache-control": "private, no-store",
      "x-content-type-options": "nosniff",
    },
  });
}
