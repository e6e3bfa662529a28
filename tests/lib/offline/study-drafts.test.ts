// A gauge study in progress lives in the tablet's database per person: it survives a reload (a new
// database handle), a sign-out keeps it for its own person only, and undo takes back the last figure.
import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { BenchDb } from "@/lib/offline/db";
import { lockDevice, waitingByPerson } from "@/lib/offline/sign-out";
import { setMeta } from "@/lib/offline/meta";
import {
  addGrrValue,
  addType1Reading,
  discardDraft,
  draftOf,
  draftsOf,
  grrEntryOrder,
  nextGrrCell,
  startDraft,
  undoLast,
} from "@/lib/offline/study-drafts";
import type { DraftGauge } from "@/lib/offline/study-draft-shape";

const GAUGE: DraftGauge = {
  id: 3,
  kind: "bore_gauge_digital",
  label: "Bore gauge",
  serial: "BG-1",
  unit: "in",
  resolution: 0.0001,
  dialPlusMeansSmaller: true,
};
const REF = { value: 4.03, expandedU: 0.00005, coverageK: 2 };
let n = 0;
const fresh = () => new BenchDb(`study-drafts-${process.pid}-${++n}`);

describe("study drafts", () => {
  it("keeps each reading at once, so a reload (a new handle on the same database) carries on", async () => {
    const db = fresh();
    await startDraft(db, 7, { kind: "type1", gauge: GAUGE, reference: REF, readings: [] });
    await addType1Reading(db, 7, 4.0301, 50);
    await addType1Reading(db, 7, 4.0302, 50);
    db.close();
    const again = new BenchDb(db.name);
    expect((await draftOf(again, 7, "type1"))?.readings).toEqual([4.0301, 4.0302]);
  });

  it("refuses a reading past the most the study takes, and keeps the ones it has", async () => {
    const db = fresh();
    await startDraft(db, 7, { kind: "type1", gauge: GAUGE, reference: REF, readings: [4.03, 4.03] });
    const out = await addType1Reading(db, 7, 4.03, 2);
    expect(out).toEqual({ error: expect.stringContaining("already has 2 readings") });
    expect((await draftOf(db, 7, "type1"))?.readings).toHaveLength(2);
  });

  it("undo takes back the last reading only, and says so when there is none", async () => {
    const db = fresh();
    await startDraft(db, 7, { kind: "type1", gauge: GAUGE, reference: REF, readings: [4.0301, 4.0305] });
    await undoLast(db, 7, "type1");
    expect((await draftOf(db, 7, "type1"))?.readings).toEqual([4.0301]);
    await undoLast(db, 7, "type1");
    expect(await undoLast(db, 7, "type1")).toEqual({ error: "There is no reading to undo" });
  });

  it("a sign-out on a shared tablet keeps each person's run, shown only to them", async () => {
    const db = fresh();
    await setMeta(db, "actor", { userId: 7, shopId: 1, name: "Rosa", email: "r@x.example", role: "machinist" });
    await startDraft(db, 7, { kind: "type1", gauge: GAUGE, reference: REF, readings: [4.0301] });
    await startDraft(db, 9, { kind: "type1", gauge: GAUGE, reference: REF, readings: [4.0299, 4.0298] });
    expect(await lockDevice(db)).toMatchObject({ name: "Rosa", readings: 0, photos: 0, studies: 1 });
    expect(await waitingByPerson(db)).toEqual([
      { userId: 7, name: "Someone", readings: 0, photos: 0, studies: 1 },
      { userId: 9, name: "Someone", readings: 0, photos: 0, studies: 1 },
    ]);
    expect((await draftsOf(db, 7)).map((r) => r.draft)).toEqual([expect.objectContaining({ readings: [4.0301] })]);
    expect((await draftOf(db, 9, "type1"))?.readings).toEqual([4.0299, 4.0298]);
    await discardDraft(db, 7, "type1");
    expect(await draftsOf(db, 7)).toEqual([]);
    expect(await draftsOf(db, 9)).toHaveLength(1);
  });

  it("an R&R study is entered trial by trial, each appraiser through every part, and stops when full", async () => {
    const design = { appraisers: ["Ann", "Ben"], parts: 2, trials: 2, tolerance: null };
    expect(grrEntryOrder(design).map((c) => `${c.trial}${c.appraiser}${c.part}`)).toEqual([
      "111",
      "112",
      "121",
      "122",
      "211",
      "212",
      "221",
      "222",
    ]);
    const db = fresh();
    await startDraft(db, 7, { kind: "grr", gauge: GAUGE, design, measurements: [] });
    for (let i = 0; i < 8; i++) await addGrrValue(db, 7, 4 + i / 1000);
    const full = await draftOf(db, 7, "grr");
    expect(full && nextGrrCell(full)).toBeUndefined();
    expect(full?.measurements[5]).toEqual({ trial: 2, appraiser: 1, part: 2, value: 4.005 });
    expect(await addGrrValue(db, 7, 4)).toEqual({ error: expect.stringContaining("Every part has its figures") });
    await undoLast(db, 7, "grr");
    const back = await draftOf(db, 7, "grr");
    expect(back && nextGrrCell(back)).toEqual({ trial: 2, appraiser: 2, part: 2 });
  });
});
