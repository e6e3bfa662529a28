// Photos taken at the bench (a scored bore, a spun bearing): kept as Blobs in IndexedDB until
// the server holds them. Uploaded after the readings (a reading's photo needs its reading on the
// server first), each with its own id as clientId so a resend after a lost answer is harmless.
import type { BenchDb, PhotoRow } from "./db";
import { uuidv4 } from "./ids";
import { uploadFile, type Fetch } from "./transport";

export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

export interface PhotoOwner {
  jobId: number;
  ownerType: PhotoRow["ownerType"];
  ownerId: string;
}

export async function addPhoto(
  db: BenchDb,
  file: Blob & { name?: string },
  owner: PhotoOwner,
  takenBy: number,
  now = new Date(),
): Promise<PhotoRow> {
  if (!file.type.startsWith("image/")) throw new Error("That file is not a photo; pick a picture from the camera");
  if (file.size > MAX_PHOTO_BYTES) throw new Error("That photo is over 15 MB; take it again at a lower resolution");
  const row: PhotoRow = {
    id: uuidv4(),
    ...owner,
    blob: file,
    contentType: file.type,
    name: file.name || `photo-${now.toISOString()}.jpg`,
    size: file.size,
    createdAt: now.toISOString(),
    takenBy,
    state: "pending",
  };
  await db.photos.add(row);
  return row;
}

async function ownerReady(db: BenchDb, p: PhotoRow): Promise<boolean> {
  if (p.ownerType === "job") return true;
  return (await db.readings.get(p.ownerId))?.state === "synced";
}

export interface PhotoOutcome {
  uploaded: number;
  waiting: number;
  unavailable: boolean;
}

/** Uploads this user's pending photos whose owner is on the server; stops at the first 404/501. */
export async function uploadPhotos(db: BenchDb, fetchFn: Fetch, base: string, userId: number): Promise<PhotoOutcome> {
  const pending = await db.photos
    .where("state")
    .equals("pending")
    .filter((p) => p.takenBy === userId)
    .sortBy("createdAt");
  const out: PhotoOutcome = { uploaded: 0, waiting: 0, unavailable: false };
  for (const [i, p] of pending.entries()) {
    if (!p.blob || !(await ownerReady(db, p))) {
      out.waiting++;
      continue;
    }
    const form = new FormData();
    form.append("file", p.blob, p.name);
    form.append("ownerType", p.ownerType);
    form.append("ownerId", p.ownerId);
    form.append("clientId", p.id);
    const answer = await uploadFile(fetchFn, base, form);
    if (answer === "unavailable") {
      out.unavailable = true;
      out.waiting += pending.length - i;
      break;
    }
    if (answer === "ok") {
      await db.photos.update(p.id, { state: "uploaded", blob: null, error: undefined });
      out.uploaded++;
    } else {
      await db.photos.update(p.id, { state: "rejected", error: answer.refused });
    }
  }
  return out;
}
