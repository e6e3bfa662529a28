import "server-only";
import { stationWords } from "@/lib/domain";
import type { StoredReading } from "@/lib/schemas/readings";
import { getObjectBuffer } from "@/lib/server/uploads/storage";
import { listAttachments, type StoredAttachment } from "@/lib/server/uploads/repo";
import type { PhotoLine } from "@/lib/schemas/record";

// Photos of the job and of its current readings, as thumbnails fetched from object storage.
// A photo whose preview is missing (HEIC, or storage lost it) is still listed, in words.
const MAX_PHOTOS = 60;

export type RecordPhotos = { photos: PhotoLine[]; byReading: Map<string, string[]> };

export async function recordPhotos(shopId: number, jobId: number, current: StoredReading[]): Promise<RecordPhotos> {
  const readingById = new Map(current.map((r) => [r.id, r]));
  const [ofJob, ofReadings] = await Promise.all([
    listAttachments(shopId, "job", [String(jobId)]),
    listAttachments(shopId, "reading", [...readingById.keys()]),
  ]);
  const images = [...ofJob, ...ofReadings].filter((a) => a.contentType.startsWith("image/")).slice(0, MAX_PHOTOS);
  const byReading = new Map<string, string[]>();
  const photos = await Promise.all(
    images.map(async (a: StoredAttachment, i): Promise<PhotoLine> => {
      const n = `Photo ${i + 1}`;
      const reading = a.ownerType === "reading" ? readingById.get(a.ownerId) : undefined;
      if (reading) byReading.set(reading.id, [...(byReading.get(reading.id) ?? []), n]);
      const thumb = a.thumbKey ? await getObjectBuffer(a.thumbKey).catch(() => null) : null;
      return {
        id: a.id,
        caption: `${n}: ${reading ? stationWords(reading.stationId) : "the job"}`,
        thumb,
        note: thumb ? a.originalName : `${a.originalName} (no preview; the shop has the full photo)`,
      };
    }),
  );
  return { photos, byReading };
}
