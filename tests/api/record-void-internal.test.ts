// What the customer sees of a voided record and what never reaches them: the customer page and
// the PDF say VOID and that a new record follows; the signature carries the registered name; the
// lead's notes to the machinist (measure/machine again) and the job's shop notes are on neither.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import CustomerRecordPage from "@/app/r/[token]/page";
import { GET as customerPdf } from "@/app/api/r/[token]/pdf/route";
import { POST as reopen } from "@/app/api/release/[jobId]/reopen/route";
import { createCustomerToken } from "@/lib/server/release/customer-link";
import { Job, User } from "@/models";
import { pdfText } from "../support/pdf-text";
import { ACCEPT_REASON, createRecordJob, type RecordJob } from "../support/record-fixtures";
import { asUser, call } from "../support/requests";
import { addFlag } from "./release-fixtures";

const MACHINIST_NOTE = "Re-zero the bore gauge on the setting ring first; the last one drifted";
const MACHINE_NOTE = "Use the 280 stones, the 400s are worn out";
const JOB_NOTE = "Shop only: customer still owes for the last head job";

async function customerCopy(job: RecordJob) {
  const token = createCustomerToken(job.release!.id);
  const page = await CustomerRecordPage({ params: Promise.resolve({ token }) });
  const html = renderToStaticMarkup(page);
  const res = await customerPdf(new Request(`http://localhost/api/r/${token}/pdf`), {
    params: Promise.resolve({ token }),
  });
  expect(res.status).toBe(200);
  const { text } = await pdfText(Buffer.from(await res.arrayBuffer()));
  return { html: html.replace(/<[^>]+>/g, " ").replace(/&#x27;/g, "'"), pdf: text };
}

describe("the customer's copy", () => {
  it("says VOID on the page and in the PDF once the lead reopens, and that a new record follows", async () => {
    const job = await createRecordJob({ photo: false });
    const standing = await customerCopy(job);
    expect(standing.html).not.toContain("VOID");
    expect(standing.pdf).toContain("RELEASED FOR ASSEMBLY");

    const reason = "Bore 2 to be honed again after all";
    const res = await call(
      reopen,
      await asUser(job.users.lead, "POST", `/api/release/${job.job.id}/reopen`, { reason }),
      { jobId: String(job.job.id) },
    );
    expect(res.status).toBe(200);
    const voided = await customerCopy(job);
    expect(voided.html).toContain("VOID");
    expect(voided.html).toContain(`Reason: ${reason}`);
    expect(voided.html).toContain("When the job is released again");
    expect(voided.html).not.toContain("Released for assembly");
    expect(voided.pdf).toContain("VOID: this release was withdrawn");
    expect(voided.pdf).toContain("When the job is released again, the shop sends a new record.");
    expect(voided.pdf).toContain("THIS RELEASE IS VOID");
  });

  it("shows the signer's registered name, not the name as typed", async () => {
    const job = await createRecordJob({ photo: false });
    // The account was renamed after signing: the record follows the users table.
    await User.update({ name: "Registered Inspector Name" }, { where: { id: job.users.inspector.id } });
    const copy = await customerCopy(job);
    expect(copy.html).toContain("Signed by Registered Inspector Name, inspector");
    expect(copy.pdf).toContain("Signed by Registered Inspector Name, inspector");
    expect(copy.pdf).toContain("E-signature of Registered Inspector Name");
    expect(copy.pdf).not.toContain(job.release!.signedName);
  });

  it("never prints notes meant for the machinist or the shop; an acceptance keeps its reason", async () => {
    const job = await createRecordJob({ photo: false });
    await Job.update({ notes: JOB_NOTE }, { where: { id: job.job.id } });
    await addFlag(job, "bore/3/top/A", {
      state: "disposed",
      disposition: "measure_again",
      dispositionReason: MACHINIST_NOTE,
    });
    await addFlag(job, "bore/4/top/A", {
      state: "disposed",
      disposition: "machine_again",
      operation: "Hone",
      dispositionReason: MACHINE_NOTE,
    });
    const copy = await customerCopy(job);
    for (const text of [copy.html, copy.pdf]) {
      expect(text).toContain("Measure again");
      expect(text).toContain("Machine again (Hone)");
      expect(text).toContain(ACCEPT_REASON);
      expect(text).not.toContain("Re-zero the bore gauge");
      expect(text).not.toContain("280 stones");
      expect(text).not.toContain("customer still owes");
    }
  });
});
