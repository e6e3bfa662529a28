// Running the selection on a job's measured journals and housings, previewing a hand change and
// saving it. Figures are invented test fixtures; the window is tests/support/factories.ts's main oil
// clearance 0.0015–0.0025 in (target its middle, 0.0020 in). Installed clearance = housing bore −
// both walls − journal (common practice), and a set "0.001 in thinner" loosens by 0.0005 in per half.
import { beforeAll, describe, expect, it } from "vitest";
import { POST as SELECT } from "@/app/api/jobs/[jobId]/bearings/select/route";
import { PUT as SAVE } from "@/app/api/jobs/[jobId]/bearings/choice/route";
import { POST as PREVIEW } from "@/app/api/jobs/[jobId]/bearings/choice/preview/route";
import { POST as ADD } from "@/app/api/jobs/[jobId]/bearings/shells/route";
import { PUT as HOUSINGS } from "@/app/api/jobs/[jobId]/bearings/housings/route";
import { GET } from "@/app/api/jobs/[jobId]/bearings/route";
import { AuditEvent } from "@/models";
import type { BearingsView, SelectionAnswer } from "@/lib/schemas/bearings";
import { createShop, type TestShop, type TestUser } from "../support/factories";
import { asUser, call } from "../support/requests";
import { push, reading } from "./sync-fixtures";

let a: TestShop;
let std = 0;
let thin = 0;
const url = (id: number, tail: string) => `/api/jobs/${id}/bearings${tail}`;
const send = async (h: unknown, by: TestUser, method: string, tail: string, body?: unknown) =>
  call(h as never, await asUser(by, method, url(a.job.id, tail), body), { jobId: String(a.job.id) });

beforeAll(async () => {
  a = await createShop();
  const lead = a.users.lead;
  const shell = (over: Record<string, unknown>) => ({ series: "Series S", role: "main", halvesUpper: 5, ...over });
  await send(
    ADD,
    lead,
    "POST",
    "/shells",
    shell({ step: "standard", wallSource: "nominal", wall: 0.0622, halvesLower: 5 }),
  );
  await send(
    ADD,
    lead,
    "POST",
    "/shells",
    shell({ step: "thinner", stepAmount: 0.001, halvesUpper: 2, halvesLower: 2 }),
  );
  const view = (await send(GET, lead, "GET", "")).body as BearingsView;
  std = view.shells.find((s) => s.step === "standard")!.id;
  thin = view.shells.find((s) => s.step === "thinner")!.id;
  const journals = (m: number, d: number) =>
    ["front", "rear"].flatMap((p) => ["A", "B"].map((x) => reading(a.job.id, `main/${m}/${p}/${x}`, d)));
  expect((await push(a.users.machinist, [...journals(1, 2.449), ...journals(2, 2.45)])).status).toBe(200);
  const housing = (point: string) => ({ point, housingBore: 2.5754, housingGaugeId: a.instrument.id });
  await send(HOUSINGS, lead, "PUT", "/housings", { points: [housing("main/1"), housing("main/2")] });
});

describe("bearing selection on a job", () => {
  it("only a lead runs it", async () => {
    expect((await send(SELECT, a.users.machinist, "POST", "/select")).status).toBe(403);
    expect((await send(SELECT, a.users.inspector, "POST", "/select")).status).toBe(403);
  });

  it("keeps standard halves on the journal that lands on target, thinner ones on the tight one", async () => {
    const res = await send(SELECT, a.users.lead, "POST", "/select");
    expect(res.status).toBe(200);
    const answer = res.body as SelectionAnswer;
    const main1 = answer.points.find((p) => p.point === "main/1")!;
    const main2 = answer.points.find((p) => p.point === "main/2")!;
    // 2.5754 − 2 × 0.0622 − 2.4490 = 0.0020 in (target)
    expect(main1).toMatchObject({ upperShellId: std, lowerShellId: std, predicted: { value: 0.002 } });
    // 2.5754 − 2 × 0.0617 − 2.4500 = 0.0020 in with both halves 0.0005 in thinner
    expect(main2).toMatchObject({ upperShellId: thin, lowerShellId: thin, predicted: { value: 0.002 } });
    expect(main2.predicted!.verdict).toBe("in_spec");
    expect(answer.advice.join(" ")).toMatch(/Main 3: measure its journal/);
    expect(answer.stock.find((s) => s.shellId === thin)).toMatchObject({ left: { upper: 1, lower: 1 } });
  });

  it("previews a hand change (what moves) without saving, then saves it audited", async () => {
    const choice = {
      points: [
        { point: "main/1", upperShellId: std, lowerShellId: std },
        { point: "main/2", upperShellId: thin, lowerShellId: std, byHand: true },
      ],
    };
    const preview = (await send(PREVIEW, a.users.lead, "POST", "/choice/preview", choice)).body as SelectionAnswer;
    expect(preview.problems).toEqual([]);
    // One half thinner (the thicker half in the cap of a main, common practice):
    // 2.5754 − 0.0622 − 0.0617 − 2.4500 = 0.0015 in, on the window's lower edge.
    expect(preview.points.find((p) => p.point === "main/2")!.predicted!.value).toBe(0.0015);
    expect(preview.moved.length).toBe(2); // nothing was saved yet, so both points move
    const saved = await send(SAVE, a.users.lead, "PUT", "/choice", choice);
    expect(saved.status).toBe(200);
    const view = (await send(GET, a.users.lead, "GET", "")).body as BearingsView;
    expect(view.points.find((p) => p.point === "main/2")).toMatchObject({ byHand: true, predicted: { value: 0.0015 } });
    expect(view.shells.find((s) => s.id === thin)!.used).toEqual({ upper: 1, lower: 0 });
    const again = (await send(PREVIEW, a.users.lead, "POST", "/choice/preview", choice)).body as SelectionAnswer;
    expect(again.moved).toEqual([]);
    const events = await AuditEvent.findAll({ where: { shopId: a.shop.id, action: "bearings.choice" } });
    expect(events).toHaveLength(1);
  });

  it("refuses more halves than on hand, and half a choice, saying which", async () => {
    const thick = {
      series: "Series S",
      role: "main",
      step: "thicker",
      stepAmount: 0.001,
      halvesUpper: 1,
      halvesLower: 1,
    };
    const view = (await send(ADD, a.users.lead, "POST", "/shells", thick)).body as BearingsView;
    const id = view.shells.find((s) => s.step === "thicker")!.id;
    const over = {
      points: [
        { point: "main/1", upperShellId: id, lowerShellId: id },
        { point: "main/2", upperShellId: id, lowerShellId: id },
        { point: "main/3", upperShellId: std, lowerShellId: null },
      ],
    };
    const res = await send(SAVE, a.users.lead, "PUT", "/choice", over);
    expect(res.status).toBe(422);
    const message = (res.body as { error: { message: string } }).error.message;
    expect(message).toMatch(/2 upper halves of .* only 1 are on hand/);
    expect(message).toMatch(/main\/3: choose both the upper and the lower half/);
  });
});
