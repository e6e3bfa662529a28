// A signed release's build record is rendered once, at signing, kept in object storage with its
// SHA-256 on the release, and the desk, the customer's link and the e-mail hand out those bytes.
// When storing fails at signing the signature stands and the first reader stores the one copy.
import { createHash } from "node:crypto";
import { describe, expect, it, vi } from "vitest";
import { GET as customerPdf } from "@/app/api/r/[token]/pdf/route";
import { GET as deskPdf } from "@/app/api/record/[jobId]/pdf/route";
import { POST as sign } from "@/app/api/release/[jobId]/route";
import { drawRecord } from "@/lib/server/record/document";
import { deliverPendingMail } from "@/lib/server/mail/outbox-worker";
import type { OutgoingMail } from "@/lib/server/mail/send";
import { createCustomerToken } from "@/lib/server/release/customer-link";
import { getObjectBuffer, putObject } from "@/lib/server/uploads/storage";
import { MailOutbox, Release } from "@/models";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";
import { completeJob } from "./release-fixtures";

vi.mock("@/lib/server/record/document", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/server/record/document")>();
  return { ...real, drawRecord: vi.fn(real.drawRecord) };
});
vi.mock("@/lib/server/uploads/storage", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/server/uploads/storage")>();
  return { ...real, putObject: vi.fn(real.putObject) };
});

const sha256 = (b: Buffer) => createHash("sha256").update(b).digest("hex");

async function signJob(s: TestShop): Promise<number> {
  const req = await asUser(s.users.inspector, "POST", `/api/release/${s.job.id}`, {
    fullName: s.users.inspector.name,
    password: TEST_PASSWORD,
  });
  const res = await call(sign, req, { jobId: String(s.job.id) });
  expect(res.status).toBe(201);
  return res.body.release.id as number;
}

async function fromDesk(s: TestShop): Promise<Buffer> {
  const req = await asUser(s.users.lead, "GET", `/api/record/${s.job.id}/pdf`);
  const res = await deskPdf(req, { params: Promise.resolve({ jobId: String(s.job.id) }) });
  expect(res.status).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

async function fromLink(releaseId: number): Promise<Buffer> {
  const token = createCustomerToken(releaseId);
  const res = await customerPdf(new Request(`http://localhost/api/r/${token}/pdf`), {
    params: Promise.resolve({ token }),
  });
  expect(res.status).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

async function fromMail(shopId: number): Promise<Buffer> {
  const due = await MailOutbox.findAll({ where: { shopId, sentAt: null, kind: "build_record" } });
  expect(due).toHaveLength(1);
  const sent: OutgoingMail[] = [];
  await deliverPendingMail({ only: [due[0].id], budgetMs: 60_000, send: async (m) => sent.push(m) });
  expect(sent).toHaveLength(1);
  return Buffer.from(sent[0].attachments![0].content as Buffer);
}

describe("the build record of a signed release", () => {
  it("is rendered once, at signing, and served, mailed and stored as the same bytes with the kept SHA-256", async () => {
    const s = await createShop();
    await completeJob(s);
    vi.mocked(drawRecord).mockClear();
    const releaseId = await signJob(s);
    expect(vi.mocked(drawRecord)).toHaveBeenCalledTimes(1);
    const release = await Release.findByPk(releaseId);
    expect(release!.recordSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(release!.recordKey).toMatch(new RegExp(`^${s.shop.id}/records/release-${releaseId}-`));
    const stored = (await getObjectBuffer(release!.recordKey!))!;
    expect(stored.subarray(0, 5).toString()).toBe("%PDF-");
    expect(release!.recordBytes).toBe(stored.length);
    expect(sha256(stored)).toBe(release!.recordSha256);

    const [desk, link, mailed] = [await fromDesk(s), await fromLink(releaseId), await fromMail(s.shop.id)];
    expect(desk.equals(stored)).toBe(true);
    expect(link.equals(stored)).toBe(true);
    expect(mailed.equals(stored)).toBe(true);
    expect(sha256(mailed)).toBe(release!.recordSha256);
    expect(vi.mocked(drawRecord)).toHaveBeenCalledTimes(1); // no render after the signature's
  });

  it("keeps the signature when storage fails at signing; the first readers keep one copy between them", async () => {
    const s = await createShop();
    await completeJob(s);
    // Every try at signing fails (three), as a store that is down would.
    for (let i = 0; i < 3; i++) vi.mocked(putObject).mockRejectedValueOnce(new Error("store unreachable (test)"));
    const releaseId = await signJob(s);
    const before = await Release.findByPk(releaseId);
    expect(before!.voidedAt).toBeNull();
    expect(before!.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(before!.recordKey).toBeNull();

    // Two readers at once: each may render, one copy is kept and both hand it out.
    const [link, desk] = await Promise.all([fromLink(releaseId), fromDesk(s)]);
    const after = await Release.findByPk(releaseId);
    const stored = (await getObjectBuffer(after!.recordKey!))!;
    expect(sha256(stored)).toBe(after!.recordSha256);
    expect(link.equals(stored)).toBe(true);
    expect(desk.equals(stored)).toBe(true);
    expect((await fromMail(s.shop.id)).equals(stored)).toBe(true);
  });

  it("stores the file again when storage has lost it, and keeps the new SHA-256", async () => {
    const s = await createShop();
    await completeJob(s);
    const releaseId = await signJob(s);
    const first = await Release.findByPk(releaseId);
    const { deleteObject } = await import("@/lib/server/uploads/storage");
    await deleteObject(first!.recordKey!);
    const desk = await fromDesk(s);
    const after = await Release.findByPk(releaseId);
    expect(after!.recordSha256).toBe(sha256(desk));
    expect((await getObjectBuffer(after!.recordKey!))!.equals(desk)).toBe(true);
    expect((await fromLink(releaseId)).equals(desk)).toBe(true);
  });
});
