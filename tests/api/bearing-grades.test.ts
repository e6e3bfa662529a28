// Factory grade tables: imported from our documented JSON by a lead, listed for the office roles,
// replaced by name, refused with words naming what to fix, removed; each change audited.
import { beforeAll, describe, expect, it } from "vitest";
import { GET, POST } from "@/app/api/bearing-grades/route";
import { DELETE } from "@/app/api/bearing-grades/[tableId]/route";
import { AuditEvent } from "@/models";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";

const ROLES = ["machinist", "lead", "inspector", "admin"] as const;
let a: TestShop;
let b: TestShop;
beforeAll(async () => {
  a = await createShop();
  b = await createShop();
});

// Test fixture (invented grades and walls, mm).
const file = (over: Record<string, unknown> = {}) => ({
  format: "tenthwise.bearing-grades",
  version: 1,
  tables: [
    {
      name: "Test rods",
      role: "rod",
      unit: "mm",
      grades: [
        { grade: "1", wallMin: 1.481, wallMax: 1.484 },
        { grade: "2", wallMin: 1.484, wallMax: 1.487 },
      ],
      cells: [
        { housingCode: "A", journalCode: "1", grade: "1" },
        { housingCode: "A", journalCode: "2", grade: "2" },
      ],
      ...over,
    },
  ],
});
type Listed = { tables: { id: number; name: string; table: { grades: unknown[] } }[] };
const get = async (by: TestUser) => call(GET as never, await asUser(by, "GET", "/api/bearing-grades"));
const post = async (by: TestUser, body: unknown) =>
  call(POST as never, await asUser(by, "POST", "/api/bearing-grades", body));
const del = async (by: TestUser, id: number) =>
  call(DELETE as never, await asUser(by, "DELETE", `/api/bearing-grades/${id}`), { tableId: String(id) });

describe("/api/bearing-grades", () => {
  it.each(ROLES)("as %s: list, import", async (role) => {
    expect((await get(a.users[role])).status).toBe(role === "machinist" ? 403 : 200);
    expect((await post(a.users[role], file())).status).toBe(role === "lead" ? 200 : 403);
  });

  it("replaces a table imported again under its name, and keeps shops apart", async () => {
    const three = file({ grades: [...file().tables[0].grades, { grade: "3", wallMin: 1.487, wallMax: 1.49 }] });
    expect((await post(a.users.lead, three)).status).toBe(200);
    const listed = (await get(a.users.lead)).body as Listed;
    expect(listed.tables).toHaveLength(1);
    expect(listed.tables[0].table.grades).toHaveLength(3);
    expect(((await get(b.users.lead)).body as Listed).tables).toHaveLength(0);
    expect((await del(b.users.lead, listed.tables[0].id)).status).toBe(404);
  });

  it("refuses a bad file saying what to fix", async () => {
    const wrong = await post(a.users.lead, { ...file(), format: "something-else" });
    expect(wrong.status).toBe(422);
    const unknownGrade = await post(
      a.users.lead,
      file({ cells: [{ housingCode: "A", journalCode: "1", grade: "9" }] }),
    );
    expect(unknownGrade.status).toBe(422);
    expect(JSON.stringify(unknownGrade.body)).toMatch(/grade 9/);
  });

  it("removes a table, audited", async () => {
    const id = ((await get(a.users.lead)).body as Listed).tables[0].id;
    expect((await del(a.users.lead, id)).status).toBe(200);
    const actions = (await AuditEvent.findAll({ where: { shopId: a.shop.id } })).map((e) => e.action);
    expect(actions).toEqual(
      expect.arrayContaining(["bearings.grades_import", "bearings.grades_replace", "bearings.grades_remove"]),
    );
  });
});
