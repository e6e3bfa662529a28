// Uploads through the fake S3 store (s3rver, started by `npm test`): round trip, sniffing,
// size limit, idempotent resend, roles and shop scoping.
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { GET as list, POST as upload } from "@/app/api/attachments/route";
import { GET as download } from "@/app/api/attachments/[id]/route";
import { GET as thumb } from "@/app/api/attachments/[id]/thumb/route";
import { Attachment, Instrument, Job, Reading } from "@/models";
import { createShop, type TestUser } from "../support/factories";
import { asUser, call, cookieFor, pageRequest } from "../support/requests";

async function photo(width = 1200, height = 800): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 180, g: 40, b: 30 } } })
    .jpeg()
    .toBuffer();
}

// The first bytes of a Linux executable (ELF magic, 64-bit, little-endian), padded out.
const ELF = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(4088, 0x90)]);
const PDF = Buffer.from(
  "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
);

type Fields = { ownerType: string; ownerId: string | number; clientId?: string };

async function post(user: TestUser | null, fields: Fields, bytes: Buffer, name = "photo.jpg", type = "image/jpeg") {
  const form = new FormData();
  form.set("file", new File([new Uint8Array(bytes)], name, { type }));
  form.set("ownerType", fields.ownerType);
  form.set("ownerId", String(fields.ownerId));
  form.set("clientId", fields.clientId ?? randomUUID());
  const headers: Record<string, string> = user ? { cookie: await cookieFor(user) } : {};
  return call(upload, pageRequest("/api/attachments", { method: "POST", headers, body: form }));
}

async function fetchRaw(handler: typeof download, user: TestUser, id: string) {
  const res = await handler(await asUser(user, "GET", `/api/attachments/${id}`), { params: Promise.resolve({ id }) });
  return { status: res.status, type: res.headers.get("content-type"), bytes: Buffer.from(await res.arrayBuffer()) };
}

async function addReading(shopId: number, jobId: number, userId: number): Promise<string> {
  const id = randomUUID();
  await Reading.create({
    id,
    shopId,
    jobId,
    stationId: "bore/1/top/A",
    characteristic: "bore_diameter",
    valueCanonical: 102.3627,
    value: 4.03,
    unit: "in",
    takenBy: userId,
    takenAt: new Date(),
    deviceId: "test-tablet",
  });
  return id;
}

describe("POST /api/attachments", () => {
  it("stores a job photo in S3 under a key we made, with a JPEG preview, and streams both back", async () => {
    const s = await createShop();
    const original = await photo();
    const res = await post(
      s.users.machinist,
      { ownerType: "job", ownerId: s.job.id },
      original,
      "../../etc/passwd.jpg",
    );
    expect(res.status).toBe(201);
    const a = res.body.attachment;
    expect(a).toMatchObject({
      ownerType: "job",
      ownerId: String(s.job.id),
      contentType: "image/jpeg",
      sizeBytes: original.length,
      hasThumb: true,
      originalName: "passwd.jpg",
    });
    const row = await Attachment.findByPk(a.id);
    expect(row!.objectKey).toMatch(new RegExp(`^${s.shop.id}/[0-9a-f-]{36}$`));
    expect(row!.thumbKey).toBe(`${row!.objectKey}-thumb.jpg`);

    const file = await fetchRaw(download, s.users.inspector, a.id);
    expect(file.status).toBe(200);
    expect(file.type).toBe("image/jpeg");
    expect(file.bytes.equals(original)).toBe(true);
    const preview = await fetchRaw(thumb, s.users.lead, a.id);
    expect(preview.status).toBe(200);
    const meta = await sharp(preview.bytes).metadata();
    expect(meta.format).toBe("jpeg");
    expect(Math.max(meta.width!, meta.height!)).toBe(320);
    expect(meta.width! / meta.height!).toBeCloseTo(1200 / 800, 1);
  });

  it("returns the stored attachment, not a duplicate, when the same clientId is sent again", async () => {
    const s = await createShop();
    const clientId = randomUUID();
    const first = await post(s.users.machinist, { ownerType: "job", ownerId: s.job.id, clientId }, await photo());
    const again = await post(s.users.machinist, { ownerType: "job", ownerId: s.job.id, clientId }, await photo());
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.body.created).toBe(false);
    expect(again.body.attachment.id).toBe(first.body.attachment.id);
    expect(await Attachment.count({ where: { clientId } })).toBe(1);
    // The same clientId for a different owner is a device bug, not a resend.
    const misused = await post(s.users.machinist, { ownerType: "job", ownerId: s.job.id + 1, clientId }, await photo());
    expect(misused.status).toBe(409);
  });

  it("answers another shop's clientId like a fresh one, and stores nothing across shops", async () => {
    const a = await createShop();
    const b = await createShop();
    const used = randomUUID();
    const theirs = await post(
      b.users.machinist,
      { ownerType: "job", ownerId: b.job.id, clientId: used },
      await photo(),
    );
    const fresh = await post(a.users.machinist, { ownerType: "job", ownerId: a.job.id }, await photo());
    const reused = await post(
      a.users.machinist,
      { ownerType: "job", ownerId: a.job.id, clientId: used },
      await photo(),
    );
    // The same answer as a fresh clientId gets: 201, created, an id of the server's own.
    expect([theirs.status, fresh.status, reused.status]).toEqual([201, 201, 201]);
    expect(reused.body.created).toBe(fresh.body.created);
    expect(Object.keys(reused.body.attachment).sort()).toEqual(Object.keys(fresh.body.attachment).sort());
    expect(reused.body.attachment.id).not.toBe(used);
    expect(reused.body.attachment.id).not.toBe(theirs.body.attachment.id);
    // Each shop has its own file under that clientId; the other shop's is untouched and still its own.
    const rows = await Attachment.findAll({ where: { clientId: used }, order: [["shopId", "ASC"]] });
    expect(rows.map((r) => [r.shopId, r.ownerId])).toEqual([
      [a.shop.id, String(a.job.id)],
      [b.shop.id, String(b.job.id)],
    ]);
    expect((await fetchRaw(download, a.users.lead, theirs.body.attachment.id)).status).toBe(404);
    expect((await fetchRaw(download, b.users.lead, theirs.body.attachment.id)).status).toBe(200);
    // A resend in the other shop is still that shop's replay.
    const again = await post(b.users.machinist, { ownerType: "job", ownerId: b.job.id, clientId: used }, await photo());
    expect([again.status, again.body.attachment.id]).toEqual([200, theirs.body.attachment.id]);
  });

  it("refuses an executable renamed .jpg (415) and says what it is", async () => {
    const s = await createShop();
    const res = await post(
      s.users.machinist,
      { ownerType: "job", ownerId: s.job.id },
      ELF,
      "brake-photo.jpg",
      "image/jpeg",
    );
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe("unsupported_media");
    expect(res.body.error.message).toContain("ELF");
    expect(res.body.error.message).toContain("JPEG, PNG, WebP or HEIC");
    const text = await post(
      s.users.machinist,
      { ownerType: "job", ownerId: s.job.id },
      Buffer.from("just some words\n".repeat(50)),
      "x.jpg",
    );
    expect(text.status).toBe(415);
    // JPEG magic bytes followed by junk: sniffed as JPEG, but not a picture.
    const broken = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(2000, 7)]);
    const damaged = await post(s.users.machinist, { ownerType: "job", ownerId: s.job.id }, broken, "cracked.jpg");
    expect(damaged.status).toBe(415);
    expect(damaged.body.error.message).toContain("damaged");
    expect(await Attachment.count({ where: { shopId: s.shop.id } })).toBe(0);
  });

  it("refuses a file over UPLOAD_MAX_BYTES (413) in words", async () => {
    const s = await createShop();
    const big = Buffer.concat([await photo(), Buffer.alloc(15 * 1024 * 1024 + 1)]);
    const res = await post(s.users.lead, { ownerType: "job", ownerId: s.job.id }, big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("payload_too_large");
    expect(res.body.error.message).toMatch(/The file is 15\.\d MB; the largest file Tenthwise accepts is 15\.0 MB/);
  });

  it("attaches photos to a reading, and a certificate PDF to a gauge (admin only)", async () => {
    const s = await createShop();
    const readingId = await addReading(s.shop.id, s.job.id, s.users.machinist.id);
    const onReading = await post(
      s.users.machinist,
      { ownerType: "reading", ownerId: readingId },
      await photo(400, 300),
    );
    expect(onReading.status).toBe(201);
    const listed = await call(
      list,
      await asUser(s.users.lead, "GET", `/api/attachments?ownerType=reading&ownerId=${readingId}`),
    );
    expect(listed.body.attachments.map((x: { id: string }) => x.id)).toEqual([onReading.body.attachment.id]);

    expect(
      (
        await post(
          s.users.machinist,
          { ownerType: "instrument", ownerId: s.instrument.id },
          PDF,
          "cert.pdf",
          "application/pdf",
        )
      ).status,
    ).toBe(403);
    const cert = await post(
      s.users.admin,
      { ownerType: "instrument", ownerId: s.instrument.id },
      PDF,
      "cert.pdf",
      "application/pdf",
    );
    expect(cert.status).toBe(201);
    expect(cert.body.attachment).toMatchObject({ contentType: "application/pdf", hasThumb: false, thumbUrl: null });
    expect((await Instrument.findByPk(s.instrument.id))!.certificateAttachmentId).toBe(cert.body.attachment.id);
    expect((await fetchRaw(thumb, s.users.admin, cert.body.attachment.id)).status).toBe(404);
  });

  it("checks roles, fields, shop scoping and the job lock", async () => {
    const a = await createShop();
    const b = await createShop();
    expect((await post(null, { ownerType: "job", ownerId: a.job.id }, await photo())).status).toBe(401);
    expect((await post(a.users.inspector, { ownerType: "job", ownerId: a.job.id }, await photo())).status).toBe(403);
    expect((await post(a.users.admin, { ownerType: "job", ownerId: a.job.id }, await photo())).status).toBe(403);
    const bad = await post(
      a.users.lead,
      { ownerType: "engine", ownerId: a.job.id, clientId: "not-a-uuid" },
      await photo(),
    );
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["clientId", "ownerType"]);

    const otherShop = await post(a.users.lead, { ownerType: "job", ownerId: b.job.id }, await photo());
    expect(otherShop.status).toBe(404);
    const bReading = await addReading(b.shop.id, b.job.id, b.users.machinist.id);
    expect((await post(a.users.lead, { ownerType: "reading", ownerId: bReading }, await photo())).status).toBe(404);
    const bFile = await post(b.users.lead, { ownerType: "job", ownerId: b.job.id }, await photo());
    expect((await fetchRaw(download, a.users.lead, bFile.body.attachment.id)).status).toBe(404);
    expect((await fetchRaw(download, b.users.machinist, bFile.body.attachment.id)).status).toBe(403);

    await Job.update({ status: "released", lockedAt: new Date() }, { where: { id: a.job.id } });
    const locked = await post(a.users.machinist, { ownerType: "job", ownerId: a.job.id }, await photo());
    expect(locked.status).toBe(409);
    expect(locked.body.error.message).toContain(
      "is released: its photos and files cannot change. Only a lead can reopen it",
    );
  });
});
