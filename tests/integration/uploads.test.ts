// A photo taken on the tablet with no network reaches S3 after reconnecting, exactly once: the
// tablet's own upload code (lib/offline/photos.ts, on fake-indexeddb) against the real handler.
import "fake-indexeddb/auto";
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/attachments/route";
import { GET as download } from "@/app/api/attachments/[id]/route";
import { BenchDb } from "@/lib/offline/db";
import { addPhoto, uploadPhotos } from "@/lib/offline/photos";
import type { Fetch } from "@/lib/offline/transport";
import { Attachment } from "@/models";
import { createShop } from "../support/factories";
import { asUser, cookieFor, pageRequest } from "../support/requests";

const BASE = "http://localhost";

/** The app's upload route as the tablet's fetch, with the machinist's session cookie. */
function online(cookie: string, after?: () => void): Fetch {
  return (async (url: string | URL | Request, init?: RequestInit) => {
    const res = await POST(pageRequest(String(url), { method: init?.method, body: init?.body, headers: { cookie } }));
    after?.();
    return res;
  }) as Fetch;
}

const offline: Fetch = (async () => {
  throw new TypeError("fetch failed");
}) as Fetch;

describe("offline photos", () => {
  it("stay on the tablet while offline and upload once after reconnecting, even when an answer is lost", async () => {
    const s = await createShop();
    const db = new BenchDb(`uploads-${randomUUID()}`);
    const machinist = s.users.machinist;
    const bytes = await sharp({ create: { width: 900, height: 600, channels: 3, background: { r: 90, g: 90, b: 90 } } })
      .jpeg()
      .toBuffer();
    const owner = { jobId: s.job.id, ownerType: "job" as const, ownerId: String(s.job.id) };
    const photo = await addPhoto(
      db,
      new File([new Uint8Array(bytes)], "scored-bore.jpg", { type: "image/jpeg" }),
      owner,
      machinist.id,
    );

    await expect(uploadPhotos(db, offline, BASE, machinist.id)).rejects.toThrow("No connection");
    expect(await db.photos.get(photo.id)).toMatchObject({ state: "pending" });
    expect(await Attachment.count({ where: { shopId: s.shop.id } })).toBe(0);

    const cookie = await cookieFor(machinist);
    expect(await uploadPhotos(db, online(cookie), BASE, machinist.id)).toEqual({
      uploaded: 1,
      waiting: 0,
      unavailable: false,
    });
    expect(await db.photos.get(photo.id)).toMatchObject({ state: "uploaded", blob: null });
    // The tablet's photo id is the upload's clientId; the server gives the stored file its own id.
    const stored = await Attachment.findOne({ where: { shopId: s.shop.id, clientId: photo.id } });
    expect(stored).toMatchObject({
      shopId: s.shop.id,
      ownerType: "job",
      ownerId: String(s.job.id),
      contentType: "image/jpeg",
      sizeBytes: bytes.length,
    });
    const res = await download(await asUser(s.users.lead, "GET", `/api/attachments/${stored!.id}`), {
      params: Promise.resolve({ id: stored!.id }),
    });
    expect(Buffer.from(await res.arrayBuffer()).equals(bytes)).toBe(true);

    // The server stores the second photo but the answer never reaches the tablet; the resend
    // with the same clientId finds the stored one.
    const second = await addPhoto(
      db,
      new File([new Uint8Array(bytes)], "journal.jpg", { type: "image/jpeg" }),
      owner,
      machinist.id,
    );
    await expect(
      uploadPhotos(
        db,
        online(cookie, () => {
          throw new TypeError("connection reset");
        }),
        BASE,
        machinist.id,
      ),
    ).rejects.toThrow("No connection");
    expect(await db.photos.get(second.id)).toMatchObject({ state: "pending" });
    expect(await uploadPhotos(db, online(cookie), BASE, machinist.id)).toEqual({
      uploaded: 1,
      waiting: 0,
      unavailable: false,
    });
    expect(await Attachment.count({ where: { shopId: s.shop.id } })).toBe(2);
    expect(await Attachment.count({ where: { clientId: second.id } })).toBe(1);
    db.close();
  });
});
