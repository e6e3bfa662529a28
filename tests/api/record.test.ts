// The build record PDF: rendered by the route handler, read back with pdf-parse, and one page
// rendered to PNG (pdftoppm, when installed) for a person to look at in tests/artifacts/.
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, writeFileSync } from "node:fs";
import { Op } from "sequelize";
import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/record/[jobId]/pdf/route";
import { POST as send } from "@/app/api/record/[jobId]/send/route";
import { MailOutbox, Release } from "@/models";
import { createShop, type TestUser } from "../support/factories";
import { ACCEPT_REASON, createRecordJob } from "../support/record-fixtures";
import { renderRecordPdf } from "@/lib/server/record/pdf";
import type { BuildRecord, ReadingLine } from "@/lib/schemas/record";
import { pdfText } from "../support/pdf-text";
import { asUser, call } from "../support/requests";
import { asOwner } from "../support/owner-db";

async function getPdf(user: TestUser | null, jobId: number, query = "") {
  const res = await GET(await asUser(user, "GET", `/api/record/${jobId}/pdf${query}`), {
    params: Promise.resolve({ jobId: String(jobId) }),
  });
  return {
    status: res.status,
    type: res.headers.get("content-type"),
    disposition: res.headers.get("content-disposition"),
    bytes: Buffer.from(await res.arrayBuffer()),
  };
}

function hasPdftoppm(): boolean {
  try {
    execFileSync("pdftoppm", ["-v"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}

describe("GET /api/record/[jobId]/pdf", () => {
  it(
    "prints readings with limits and verdicts, derived values, torque with lubricant, decisions, the plan, " +
      "the signature and the hash",
    async () => {
      const job = await createRecordJob();
      const res = await getPdf(job.users.inspector, job.job.id);
      expect(res.status).toBe(200);
      expect(res.type).toBe("application/pdf");
      expect(res.disposition).toBe(`inline; filename="build-record-${job.job.code}.pdf"`);
      expect(res.bytes.subarray(0, 5).toString()).toBe("%PDF-");
      const { text, pages } = await pdfText(res.bytes);
      expect(pages).toBeGreaterThanOrEqual(2);
      // Readings as entered, with their limits and the verdict in words.
      expect(text).toContain("4.0301 in");
      expect(text).toContain("4.0295 to 4.0305 in");
      expect(text).toContain("4.0309 in");
      expect(text).toMatch(/OUT OF SPEC/);
      expect(text).toMatch(/IN SPEC/);
      // Derived: main oil clearance 2.4523 − 2.4502 = 0.0021 in (test fixture arithmetic).
      expect(text).toContain("Main bearing oil clearance");
      expect(text).toContain("0.0021 in");
      expect(text).toContain("Bore taper");
      // Torque with its lubricant, and the decision on the out-of-spec bore with its reason.
      expect(text).toContain("68 lbf·ft");
      expect(text).toContain("Engine oil");
      expect(text).toContain("Moly assembly paste");
      expect(text).toContain(`Accepted as is. Reason: ${ACCEPT_REASON}`);
      expect(text).toContain(job.users.lead.name);
      // The plan and a figure the core computes from it: deck clearance 9.025 − 3.48/2 − 5.7 − 1.56 = 0.025 in.
      expect(text).toContain("Deck clearance");
      expect(text).toContain("0.0250 in (piston below the deck");
      expect(text).toContain("Static compression ratio");
      // The gauge, the photo, the signature, the hash and its check, and the safety notice.
      expect(text).toContain("Test bore gauge");
      expect(text).toContain("Photo 1: the job");
      expect(text).toContain("RELEASED FOR ASSEMBLY");
      expect(text).toContain(`Signed by ${job.release!.signedName}`);
      expect(text).toContain(job.release!.hash);
      expect(text).toContain("Matches: the record in the database now gives the same fingerprint");
      expect(text).toContain("do not replace the fastener or engine maker's instructions");
      expect(text).toContain("Follow local codes and licensed practice");
      expect(text).toContain(`Page 1 of ${pages}`);

      mkdirSync("tests/artifacts", { recursive: true });
      writeFileSync("tests/artifacts/record.pdf", res.bytes);
      if (hasPdftoppm()) {
        execFileSync("pdftoppm", [
          "-png",
          "-r",
          "80",
          "-f",
          "1",
          "-l",
          "2",
          "tests/artifacts/record.pdf",
          "tests/artifacts/record-page",
        ]);
        expect(existsSync("tests/artifacts/record-page-1.png")).toBe(true);
      } else {
        console.warn(
          "pdftoppm is not installed (poppler-utils): the PDF was written to tests/artifacts/record.pdf " +
            "but no page was rendered to PNG",
        );
      }
    },
  );

  it("marks a voided release VOID, a job never released DRAFT, and a record changed after release", async () => {
    const job = await createRecordJob();
    // Behind the app's back: the app's own account may not change a reading's figures.
    await asOwner("UPDATE readings SET value_entered = 4.0304 WHERE id = ?", [job.readings["bore/1/mid/A"]]);
    const changed = await pdfText((await getPdf(job.users.lead, job.job.id)).bytes);
    expect(changed.text).toContain("Changed since release");

    await Release.update(
      { voidedAt: new Date(), voidedBy: job.users.lead.id, voidReason: "Bore 2 to be honed again after all" },
      { where: { id: job.release!.id } },
    );
    const voided = await getPdf(job.users.lead, job.job.id);
    expect(voided.disposition).toContain("-void.pdf");
    const v = await pdfText(voided.bytes);
    expect(v.text).toContain("VOID: this release was withdrawn");
    expect(v.text).toContain("Bore 2 to be honed again after all");
    expect(v.text).toContain("THIS RELEASE IS VOID");

    const draftJob = await createRecordJob({ release: false, photo: false });
    const draft = await pdfText((await getPdf(draftJob.users.inspector, draftJob.job.id, "?download=1")).bytes);
    expect(draft.text).toContain("DRAFT: NOT RELEASED");
  });

  it("lets the lead, inspector and admin of the shop print it; refuses others", async () => {
    const job = await createRecordJob({ photo: false });
    const other = await createShop();
    for (const role of ["lead", "inspector", "admin"] as const)
      expect((await getPdf(job.users[role], job.job.id)).status).toBe(200);
    expect((await getPdf(job.users.machinist, job.job.id)).status).toBe(403);
    expect((await getPdf(null, job.job.id)).status).toBe(401);
    expect((await getPdf(other.users.lead, job.job.id)).status).toBe(404);
    expect((await getPdf(job.users.lead, job.job.id, "?release=99999999")).status).toBe(404);
  });

  it("POST /api/record/[jobId]/send queues the record to the customer again, with words when it cannot", async () => {
    const job = await createRecordJob({ photo: false });
    const other = await createShop();
    const post = async (user: TestUser, jobId = job.job.id) =>
      call(send, await asUser(user, "POST", `/api/record/${jobId}/send`), { jobId: String(jobId) });
    expect((await post(job.users.inspector)).status).toBe(202);
    expect((await post(job.users.lead)).status).toBe(202);
    expect(
      await MailOutbox.count({
        where: {
          shopId: job.shop.id,
          dedupeKey: { [Op.startsWith]: `build_record:release:${job.release!.id}:again:` },
        },
      }),
    ).toBe(2);
    expect((await post(job.users.machinist)).status).toBe(403);
    expect((await post(other.users.lead, job.job.id)).status).toBe(404);
    const draft = await createRecordJob({ release: false, photo: false });
    const refused = await post(draft.users.inspector, draft.job.id);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toContain("no standing release");
    await asOwner("UPDATE customers SET email = NULL WHERE shop_id = ?", [job.shop.id]);
    const noMail = await post(job.users.inspector);
    expect(noMail.status).toBe(409);
    expect(noMail.body.error.message).toContain("no e-mail address");
  });

  it("renders a long record (a V8's full route and more) with its header and page number on every page", async () => {
    // Header, footer and page number are drawn on every page once the page count is known.
    const row = (i: number): ReadingLine => ({
      stationId: `bore/${i}`,
      station: `Station ${i}`,
      value: "4.0301 in",
      limits: "4.0295 to 4.0305 in",
      deviation: "+0.0001",
      verdict: "in_spec",
      verdictWords: "In spec",
      gauge: "G-1",
      takenBy: "Test machinist",
      takenAt: "2026-12-01 10:00",
      notes: i % 9 ? "" : "part at 24 °C",
      photos: [],
    });
    const record: BuildRecord = {
      generatedAt: "2026-12-01 12:00 UTC",
      pageSize: "A4",
      shop: { name: "Long shop", contact: [] },
      customer: { name: "C", contact: [] },
      job: {
        id: 1,
        code: "L-1",
        title: "Long job",
        status: "review",
        units: "mm and N·m",
        specRevision: 1,
      },
      engine: [],
      plan: null,
      sections: [
        { id: "bore", label: "Cylinder bores", what: "", rows: Array.from({ length: 320 }, (_, i) => row(i)) },
      ],
      derived: [],
      torque: [],
      flags: [],
      gauges: [],
      photos: [],
      tally: { measured: 320, inSpec: 320, marginal: 0, outOfSpec: 0, skipped: 0, unjudged: 0 },
      release: null,
      earlierReleases: [],
      safety: ["Safety line"],
      commonPractice: [],
    };
    const { text, pages } = await pdfText(await renderRecordPdf(record));
    // About 28 two-line rows fit an A4 page: 320 rows run past ten pages.
    expect(pages).toBeGreaterThan(10);
    for (let p = 1; p <= pages; p++) expect(text).toContain(`Page ${p} of ${pages}`);
    expect(text.match(/Tenthwise build record · L-1 · DRAFT/g)?.length).toBe(pages);
    expect(text).toContain("Station 319");
  }, 180_000);
});
