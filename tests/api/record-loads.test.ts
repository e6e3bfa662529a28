// A build record loads its job's record once: the sections, the photos and the check of every
// printed release (the standing one and an earlier, voided one) read the same loaded rows.
import { describe, expect, it, vi } from "vitest";
import { GET as pdf } from "@/app/api/record/[jobId]/pdf/route";
import { GET as verify } from "@/app/api/release/[jobId]/verify/route";
import { loadJobRecord } from "@/lib/server/release/repo";
import { Release } from "@/models";
import { createRecordJob, releaseJob } from "../support/record-fixtures";
import { asUser, call } from "../support/requests";

vi.mock("@/lib/server/release/repo", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/server/release/repo")>();
  return { ...real, loadJobRecord: vi.fn(real.loadJobRecord) };
});

const loads = vi.mocked(loadJobRecord);

describe("loading the job record", () => {
  it("happens once for a PDF that prints two releases, and once for a verification", async () => {
    const job = await createRecordJob({ photo: false });
    await Release.update(
      { voidedAt: new Date(), voidedBy: job.users.lead.id, voidReason: "re-torque" },
      {
        where: { id: job.release!.id },
      },
    );
    const second = await releaseJob(job, new Date(Date.now() + 1000));

    loads.mockClear();
    const res = await pdf(await asUser(job.users.inspector, "GET", `/api/record/${job.job.id}/pdf`), {
      params: Promise.resolve({ jobId: String(job.job.id) }),
    });
    expect(res.status).toBe(200);
    expect(loads).toHaveBeenCalledTimes(1);

    loads.mockClear();
    const checked = await call(verify, await asUser(job.users.inspector, "GET", `/api/release/${job.job.id}/verify`), {
      jobId: String(job.job.id),
    });
    expect(checked.status).toBe(200);
    expect(checked.body.release.id).toBe(second.id);
    expect(checked.body.status).toBe("match");
    expect(loads).toHaveBeenCalledTimes(1);
  });
});
