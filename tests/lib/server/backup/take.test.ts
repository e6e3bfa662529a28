// Keeping N backups and never leaving a half-written one (lib/server/backup/take.ts), on folders
// made here; the round trip itself is tests/integration/backup-restore.test.ts.
import { mkdir, mkdtemp, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { S3Client } from "@aws-sdk/client-s3";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { pruneBackups, takeBackup } from "@/lib/server/backup/take";

let into = "";
beforeEach(async () => {
  into = await mkdtemp(join(tmpdir(), "tw-prune-"));
});
afterEach(() => rm(into, { recursive: true, force: true }));

const MANIFEST = JSON.stringify({
  format: "tenthwise.backup",
  version: 1,
  app: { name: "tenthwise", version: "0.1.0" },
  startedAt: "2026-12-01T02:30:00.000Z",
  finishedAt: "2026-12-01T02:30:05.000Z",
  database: { name: "t", file: "database.sql", bytes: 0, sha256: "0".repeat(64), dumpTool: "x", migrations: [] },
  objects: { bucket: "b", count: 0, bytes: 0, items: [] },
});

async function folder(name: string, manifest: string | null = MANIFEST) {
  await mkdir(join(into, name), { recursive: true });
  if (manifest !== null) await writeFile(join(into, name, "manifest.json"), manifest);
}

describe("pruneBackups", () => {
  it("keeps the newest n finished backups and touches nothing else", async () => {
    for (const day of ["01", "02", "03", "04"]) await folder(`2026-12-${day}T023000Z`);
    await folder("2026-11-30T023000Z", null); // no manifest: not known to be a backup
    await folder("2026-11-29T023000Z", "{}"); // not our manifest
    await folder("2026-12-05T023000Z.partial", null);
    await folder("photos");
    const removed = await pruneBackups(into, 2);
    expect(removed.map((f) => f.slice(into.length + 1))).toEqual(["2026-12-01T023000Z", "2026-12-02T023000Z"]);
    expect((await readdir(into)).sort()).toEqual([
      "2026-11-29T023000Z",
      "2026-11-30T023000Z",
      "2026-12-03T023000Z",
      "2026-12-04T023000Z",
      "2026-12-05T023000Z.partial",
      "photos",
    ]);
  });
});

describe("takeBackup", () => {
  it("leaves no folder behind when it fails, and says why", async () => {
    const down = new Error("connect ECONNREFUSED 127.0.0.1:4569");
    const client = { send: () => Promise.reject(down) } as unknown as S3Client;
    const db = { host: "127.0.0.1", port: 1, database: "t", username: "u", password: "p" };
    const attempt = takeBackup({ db, store: { client, bucket: "b" }, into, app: { name: "t", version: "0" } });
    await expect(attempt).rejects.toThrow(/The bucket "b" cannot be reached .*ECONNREFUSED.*check S3_ENDPOINT/);
    expect(await readdir(into)).toEqual([]);
  });
});
