// The backup folder's own format (lib/server/backup/manifest.ts) and the checksum check that guards
// every restore (lib/server/backup/files.ts), on folders written here.
import { mkdtemp, mkdir, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { stripDefiners } from "@/lib/server/backup/database";
import { sha256Of, verifyFolder } from "@/lib/server/backup/files";
import {
  BACKUP_NAME,
  backupFolderName,
  formatSums,
  objectFile,
  parseManifest,
  parseSums,
  safeRelativePath,
  type BackupManifest,
} from "@/lib/server/backup/manifest";

describe("backup folder names", () => {
  it("are the UTC start time to the second, sortable and without colons", () => {
    const name = backupFolderName(new Date("2026-12-03T09:30:12.345Z"));
    expect(name).toBe("2026-12-03T093012Z");
    expect(BACKUP_NAME.test(name)).toBe(true);
    expect(backupFolderName(new Date("2026-12-03T09:30:13Z")) > name).toBe(true);
  });
});

describe("object files", () => {
  it("keep a plain key as its path and put any other key under a digest", () => {
    expect(objectFile("12/3f0c-thumb.jpg", "d")).toBe("objects/12/3f0c-thumb.jpg");
    expect(objectFile("a/../../etc/passwd", "d1")).toBe("objects/_/d1");
    expect(objectFile("/abs", "d2")).toBe("objects/_/d2");
    expect(objectFile("with space", "d3")).toBe("objects/_/d3");
  });

  it("paths from a manifest or sums file never leave the folder", () => {
    expect(safeRelativePath("objects/1/a")).toBe(true);
    expect(safeRelativePath("../x")).toBe(false);
    expect(safeRelativePath("objects/../../x")).toBe(false);
    expect(safeRelativePath("/etc/passwd")).toBe(false);
  });
});

describe("SHA256SUMS", () => {
  // The line layout of GNU coreutils sha256sum: hash, two spaces (or space and '*'), file name.
  it("writes what sha256sum -c reads and reads it back", () => {
    const sums = [{ path: "database.sql", sha256: sha256Of("x") }];
    const text = formatSums(sums);
    expect(text).toBe(`${sha256Of("x")}  database.sql\n`);
    expect(parseSums(text)).toEqual(sums);
    expect(parseSums(`${sha256Of("x")} *database.sql\n`)).toEqual(sums);
  });

  it("names a line that is not a checksum", () => {
    expect(() => parseSums(`${sha256Of("x")}  ok\nnot a sum\n`)).toThrow(/line 2/);
    expect(() => parseSums(`${sha256Of("x")}  ../outside\n`)).toThrow(/line 1/);
  });
});

describe("definers", () => {
  it("are dropped from triggers and routines but never from row data", () => {
    const trigger =
      "/*!50003 CREATE*/ /*!50017 DEFINER=`tenthwise_owner`@`127.0.0.1`*/ /*!50003 TRIGGER audit_no_update";
    expect(stripDefiners(trigger)).toBe("/*!50003 CREATE*/ /*!50017 */ /*!50003 TRIGGER audit_no_update");
    const row = "INSERT INTO `jobs` VALUES (1,'DEFINER=`a`@`b`')";
    expect(stripDefiners(row)).toBe(row);
  });
});

const SHA = (s: string) => sha256Of(s);

function manifestFor(dump: string, photo: string): BackupManifest {
  return {
    format: "tenthwise.backup",
    version: 1,
    app: { name: "tenthwise", version: "0.1.0" },
    startedAt: "2026-12-03T09:30:12.000Z",
    finishedAt: "2026-12-03T09:30:14.000Z",
    database: {
      name: "tenthwise",
      file: "database.sql",
      bytes: dump.length,
      sha256: SHA(dump),
      dumpTool: "mariadb-dump",
      migrations: ["20261201000100-create-shops-and-users"],
    },
    objects: {
      bucket: "tenthwise",
      count: 1,
      bytes: photo.length,
      items: [{ key: "1/p", file: "objects/1/p", bytes: photo.length, sha256: SHA(photo), contentType: "image/jpeg" }],
    },
  };
}

describe("verifyFolder", () => {
  let folder = "";
  afterEach(() => rm(folder, { recursive: true, force: true }));

  async function writeBackup(dump = "-- dump\n", photo = "photo bytes") {
    folder = await mkdtemp(join(tmpdir(), "tw-backup-test-"));
    const manifest = `${JSON.stringify(manifestFor(dump, photo))}\n`;
    await mkdir(join(folder, "objects/1"), { recursive: true });
    await writeFile(join(folder, "database.sql"), dump);
    await writeFile(join(folder, "objects/1/p"), photo);
    await writeFile(join(folder, "manifest.json"), manifest);
    const sums = [
      { path: "database.sql", sha256: SHA(dump) },
      { path: "objects/1/p", sha256: SHA(photo) },
      { path: "manifest.json", sha256: SHA(manifest) },
    ];
    await writeFile(join(folder, "SHA256SUMS"), formatSums(sums));
  }

  it("returns the manifest of an intact backup", async () => {
    await writeBackup();
    expect((await verifyFolder(folder)).objects.items[0].key).toBe("1/p");
  });

  it("refuses a changed file, naming it", async () => {
    await writeBackup();
    await writeFile(join(folder, "objects/1/p"), "photo bytez");
    await expect(verifyFolder(folder)).rejects.toThrow(/objects\/1\/p does not match its checksum/);
  });

  it("refuses a missing file and a folder without sums", async () => {
    await writeBackup();
    await rm(join(folder, "database.sql"));
    await expect(verifyFolder(folder)).rejects.toThrow(/database.sql is missing/);
    await rm(join(folder, "SHA256SUMS"));
    await expect(verifyFolder(folder)).rejects.toThrow(/no SHA256SUMS/);
  });

  it("refuses a manifest that disagrees with the sums", async () => {
    await writeBackup();
    const m = JSON.parse(await readFile(join(folder, "manifest.json"), "utf8")) as BackupManifest;
    m.objects.items[0].sha256 = SHA("other");
    const text = JSON.stringify(m);
    await writeFile(join(folder, "manifest.json"), text);
    const sums = (await readFile(join(folder, "SHA256SUMS"), "utf8")).replace(/^\w+(?= {2}manifest.json)/m, SHA(text));
    await writeFile(join(folder, "SHA256SUMS"), sums);
    await expect(verifyFolder(folder)).rejects.toThrow(/objects\/1\/p: the manifest and SHA256SUMS disagree/);
  });

  it("reads only its own format", () => {
    expect(() => parseManifest("{}")).toThrow(/not a tenthwise.backup version 1 manifest/);
    expect(() => parseManifest("nope")).toThrow(/not JSON/);
  });
});
