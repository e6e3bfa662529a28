import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { addPhoto, uploadPhotos } from "@/lib/offline/photos";
import { getSyncStatus } from "@/lib/offline/meta";
import { SyncEngine } from "@/lib/offline/sync-engine";
import { FakeServer } from "./fake-server";
import { enter, freshDb } from "./helpers";

const BASE = "http://tw.test";
const jpeg = () => new Blob([new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3])], { type: "image/jpeg" });

describe("offline photos", () => {
  it("keeps the photo in IndexedDB and uploads it only after its reading is on the server", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    const [r] = await enter(db, [["bore/1/top/A", 4.0312]]);
    const photo = await addPhoto(db, jpeg(), { jobId: 1, ownerType: "reading", ownerId: r.id }, 7);
    const early = await uploadPhotos(db, server.fetch, BASE, 7);
    expect(early).toEqual({ uploaded: 0, waiting: 1, unavailable: false });
    await new SyncEngine({ db, fetch: server.fetch, baseUrl: BASE }).runOnce();
    const stored = await db.photos.get(photo.id);
    expect(stored).toMatchObject({ state: "uploaded", blob: null });
    const form = server.uploads.get(photo.id)!;
    expect([form.get("ownerType"), form.get("ownerId"), form.get("clientId")]).toEqual(["reading", r.id, photo.id]);
    expect((form.get("file") as File).size).toBe(7);
  });

  it("treats a missing upload route (404/501) as not yet available: the photo stays pending and the badge says so", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    const first = await addPhoto(db, jpeg(), { jobId: 1, ownerType: "job", ownerId: "1" }, 7);
    await addPhoto(db, jpeg(), { jobId: 1, ownerType: "job", ownerId: "1" }, 7);
    server.uploadStatus = 501;
    await new SyncEngine({ db, fetch: server.fetch, baseUrl: BASE }).runOnce();
    expect((await db.photos.get(first.id))?.state).toBe("pending");
    expect((await db.photos.get(first.id))?.blob).toBeTruthy();
    const status = await getSyncStatus(db);
    expect(status.lastError).toBe("2 photo(s) wait: the server does not take uploads yet");
    expect(status.lastSuccessAt).toBeTruthy();
  });

  it("a photo the server refuses is marked with its words and kept", async () => {
    const db = await freshDb();
    const server = new FakeServer();
    const p = await addPhoto(db, jpeg(), { jobId: 1, ownerType: "job", ownerId: "1" }, 7);
    server.uploadStatus = 415;
    await uploadPhotos(db, server.fetch, BASE, 7);
    expect(await db.photos.get(p.id)).toMatchObject({ state: "rejected", error: "Upload refused" });
  });

  it("refuses a file that is not a picture, saying what to do", async () => {
    const db = await freshDb();
    await expect(
      addPhoto(db, new Blob(["x"], { type: "text/plain" }), { jobId: 1, ownerType: "job", ownerId: "1" }, 7),
    ).rejects.toThrow(/not a photo/);
  });
});
