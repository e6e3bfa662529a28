// Backups that restore: released jobs with photos are backed up, restored into another, empty
// database and an empty bucket, and found there row for row, photo for photo, and with every release
// fingerprint still verifying by the app's own verification. Then the refusals: a damaged backup,
// an occupied database.
import { randomUUID } from "node:crypto";
import { cp, mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import mariadb from "mariadb";
import { CreateBucketCommand, GetObjectCommand } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { DbConfig } from "@/lib/server/backup/database";
import { restoreBackup } from "@/lib/server/backup/restore";
import { takeBackup } from "@/lib/server/backup/take";
import { databaseConfig, env } from "@/lib/server/core/env";
import { verifyRelease } from "@/lib/server/release/hash-verify";
import { s3Client } from "@/lib/server/uploads/storage";
import { migrations } from "@/migrations";
import { Attachment } from "@/models";
import { addJobPhoto, createRecordJob, type RecordJob } from "../support/record-fixtures";

function dbFromUrl(url: string): DbConfig {
  const u = new URL(url);
  const path = decodeURIComponent(u.pathname.slice(1));
  const [username, password] = [decodeURIComponent(u.username), decodeURIComponent(u.password)];
  return { host: u.hostname, port: Number(u.port || 3306), database: path, username, password };
}

const RESTORE_URL = process.env.TW_RESTORE_DATABASE_URL;
if (!RESTORE_URL) throw new Error("TW_RESTORE_DATABASE_URL must point at an empty test database (npm test sets it)");
const target = dbFromUrl(RESTORE_URL);
// Backups are taken and restored as the schema owner (the app's account may not read the triggers).
const source = () => databaseConfig("owner");
const knownMigrations = migrations.map((m) => m.name);

async function query<T>(db: DbConfig, sql: string, values: unknown[] = []): Promise<T[]> {
  const c = await mariadb.createConnection({ ...db, user: db.username, dateStrings: true });
  try {
    return (await c.query({ sql, bigIntAsNumber: true }, values)) as T[];
  } finally {
    await c.end();
  }
}

async function objectBytes(bucket: string, key: string) {
  const out = await s3Client().send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  return { bytes: Buffer.from(await out.Body!.transformToByteArray()), type: out.ContentType };
}

/** The app's own code, with its database and bucket pointed at the restored copies. */
async function inRestoredApp<T>(bucket: string, run: (verify: typeof verifyRelease) => Promise<T>): Promise<T> {
  const holder = globalThis as unknown as { __tenthwiseSequelize?: unknown };
  const sourceInstance = holder.__tenthwiseSequelize;
  holder.__tenthwiseSequelize = undefined;
  vi.stubEnv("DATABASE_URL", RESTORE_URL!);
  vi.stubEnv("S3_BUCKET", bucket);
  vi.resetModules();
  try {
    const { verifyRelease: verify } = await import("@/lib/server/release/hash-verify");
    const { closeSequelize } = await import("@/lib/server/core/db");
    try {
      return await run(verify);
    } finally {
      await closeSequelize();
    }
  } finally {
    vi.unstubAllEnvs();
    vi.resetModules();
    holder.__tenthwiseSequelize = sourceInstance;
  }
}

let jobs: RecordJob[] = [];
let into = "";
let folder = "";
const bucket = `tw-restore-${randomUUID().slice(0, 8)}`;

beforeAll(async () => {
  jobs = [await createRecordJob(), await createRecordJob()];
  for (const j of jobs) expect((await verifyRelease(j.shop.id, j.job.id)).status).toBe("match");
  into = await mkdtemp(join(tmpdir(), "tw-backups-"));
  const store = { client: s3Client(), bucket: env().S3_BUCKET };
  ({ folder } = await takeBackup({ db: source(), store, into, app: { name: "tenthwise", version: "test" } }));
  await s3Client().send(new CreateBucketCommand({ Bucket: bucket }));
  const restored = await restoreBackup({ folder, db: target, store: { ...store, bucket }, knownMigrations });
  expect(restored.missingObjects).toEqual([]);
}, 120_000);

afterAll(async () => {
  if (into) await rm(into, { recursive: true, force: true });
});

const shopIds = () => jobs.map((j) => j.shop.id);

describe("a restored backup", () => {
  it("holds every row of the shops' records, identical", async () => {
    // mail_outbox is left out: a running app's notifier may send (update) the shops' mail meanwhile.
    const tables = await query<{ t: string }>(
      source(),
      "SELECT table_name AS t FROM information_schema.columns WHERE table_schema = ? AND column_name = 'shop_id' " +
        "AND table_name <> 'mail_outbox' ORDER BY 1",
      [source().database],
    );
    expect(tables.map((r) => r.t)).toEqual(expect.arrayContaining(["readings", "releases", "attachments", "flags"]));
    for (const { t } of [...tables, { t: "shops" }]) {
      const column = t === "shops" ? "id" : "shop_id";
      const sql = `SELECT * FROM \`${t}\` WHERE ${column} IN (?) ORDER BY 1`;
      const [before, after] = [await query(source(), sql, [shopIds()]), await query(target, sql, [shopIds()])];
      expect(after, t).toEqual(before);
    }
  });

  it("has every reading, figure for figure", async () => {
    const sql = "SELECT * FROM readings WHERE shop_id IN (?) ORDER BY id";
    const before = await query<{ value: string }>(source(), sql, [shopIds()]);
    expect(before.length).toBeGreaterThanOrEqual(2 * 11);
    expect(await query(target, sql, [shopIds()])).toEqual(before);
  });

  it("has every photo and its preview, byte for byte", async () => {
    const rows = await Attachment.findAll({ where: { shopId: shopIds() } });
    expect(rows.length).toBe(2);
    for (const key of rows.flatMap((a) => [a.objectKey, a.thumbKey!])) {
      const [was, is] = [await objectBytes(env().S3_BUCKET, key), await objectBytes(bucket, key)];
      expect(is.bytes.equals(was.bytes), key).toBe(true);
      expect(is.type).toBe(was.type);
    }
  });

  it("verifies every release fingerprint, and would see a changed reading", async () => {
    await inRestoredApp(bucket, async (verify) => {
      for (const j of jobs) {
        const v = await verify(j.shop.id, j.job.id);
        expect(v.status, v.words).toBe("match");
        expect(v.recomputedHash).toBe(j.release!.hash);
      }
      const reading = jobs[0].readings["main/1/front/A"];
      await query(target, "UPDATE readings SET value_entered = value_entered + 0.001 WHERE id = ?", [reading]);
      expect((await verify(jobs[0].shop.id, jobs[0].job.id)).status).toBe("changed");
      await query(target, "UPDATE readings SET value_entered = value_entered - 0.001 WHERE id = ?", [reading]);
    });
  });
});

describe("a backup taken while photos are being added", () => {
  it("names no photo it lacks: the dump comes first, the objects after it", async () => {
    let adding = true;
    const added: string[] = [];
    const adder = (async () => {
      while (adding) added.push(await addJobPhoto(jobs[0]));
    })();
    const store = { client: s3Client(), bucket: env().S3_BUCKET };
    const during = await mkdtemp(join(tmpdir(), "tw-backups-during-"));
    try {
      await new Promise((r) => setTimeout(r, 300));
      const taken = await takeBackup({
        db: source(),
        store,
        into: during,
        app: { name: "tenthwise", version: "test" },
      });
      adding = false;
      await adder;
      const second = `tw-restore-${randomUUID().slice(0, 8)}`;
      await s3Client().send(new CreateBucketCommand({ Bucket: second }));
      const restored = await restoreBackup({
        folder: taken.folder,
        db: target,
        store: { ...store, bucket: second },
        force: true,
        knownMigrations,
      });
      expect(added.length).toBeGreaterThan(0);
      expect(restored.missingObjects).toEqual([]);
    } finally {
      adding = false;
      await adder;
      await rm(during, { recursive: true, force: true });
    }
  });
});

describe("restore refuses", () => {
  const store = () => ({ client: s3Client(), bucket });

  it("a backup whose files do not match their checksums, changing nothing", async () => {
    const copy = await mkdtemp(join(tmpdir(), "tw-damaged-"));
    try {
      await cp(folder, copy, { recursive: true });
      const manifest = JSON.parse(await readFile(join(copy, "manifest.json"), "utf8")) as {
        objects: { items: { file: string }[] };
      };
      const photo = join(copy, manifest.objects.items[0].file);
      const bytes = await readFile(photo);
      bytes[bytes.length >> 1] ^= 0xff;
      await writeFile(photo, bytes);
      const before = await query(target, "SELECT COUNT(*) AS n FROM readings");
      const attempt = restoreBackup({ folder: copy, db: target, store: store(), force: true, knownMigrations });
      await expect(attempt).rejects.toThrow(/damaged or incomplete.*\n.*objects\/.* does not match its checksum/);
      expect(await query(target, "SELECT COUNT(*) AS n FROM readings")).toEqual(before);
    } finally {
      await rm(copy, { recursive: true, force: true });
    }
  });

  it("a database that holds data, unless forced", async () => {
    const attempt = restoreBackup({ folder, db: target, store: store(), knownMigrations });
    await expect(attempt).rejects.toThrow(/Refusing to restore: the database .* holds data.*--force/);
    const say = vi.fn();
    const forced = await restoreBackup({ folder, db: target, store: store(), force: true, knownMigrations, say });
    expect(say).toHaveBeenCalledWith(expect.stringMatching(/^WARNING: --force/));
    expect(forced.counts.releases).toBeGreaterThanOrEqual(2);
  });

  it("a backup from a newer Tenthwise", async () => {
    const older = knownMigrations.slice(0, -1);
    const attempt = restoreBackup({ folder, db: target, store: store(), force: true, knownMigrations: older });
    await expect(attempt).rejects.toThrow(/taken by a newer Tenthwise.*Update Tenthwise first/);
  });
});
