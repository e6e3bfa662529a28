// The origin check and the JSON body rule at the edge, over EVERY state-changing route: the routes
// are found from the files under app/api, so a route added tomorrow is covered the day it lands.
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { createShop, type TestShop } from "../support/factories";
import { appOrigin } from "@/lib/server/core/origin";
import { asUser, call } from "../support/requests";

// A reverse proxy's public address (README, ALLOWED_ORIGINS); env() reads it on first use.
const PROXY = "https://tenthwise.shop.example";
process.env.ALLOWED_ORIGINS = `${PROXY}, https://second.shop.example`;
const FOREIGN = "http://evil.example";
const CHANGES = ["POST", "PUT", "PATCH", "DELETE"] as const;

type Handler = Parameters<typeof call>[0];
type Route = { path: string; method: (typeof CHANGES)[number]; handler: Handler; params: Record<string, string> };

/** app/api/jobs/[jobId]/limits/route.ts → /api/jobs/1/limits with { jobId: "1" }. */
async function stateChangingRoutes(): Promise<Route[]> {
  const files = readdirSync("app/api", { recursive: true, encoding: "utf8" })
    .map((f) => `app/api/${f.replaceAll("\\", "/")}`)
    .filter((f) => f.endsWith("/route.ts"))
    .sort();
  const routes: Route[] = [];
  for (const file of files) {
    const mod = (await import(join(process.cwd(), file))) as Record<string, unknown>;
    const segments = file
      .replace(/^app/, "")
      .replace(/\/route\.ts$/, "")
      .split("/");
    const params = Object.fromEntries(segments.filter((s) => s.startsWith("[")).map((s) => [s.slice(1, -1), "1"]));
    const path = segments.map((s) => (s.startsWith("[") ? "1" : s)).join("/");
    for (const method of CHANGES) {
      if (typeof mod[method] === "function") routes.push({ path, method, handler: mod[method] as Handler, params });
    }
  }
  return routes;
}

let routes: Route[] = [];
beforeAll(async () => {
  routes = await stateChangingRoutes();
});

const send = async (r: Route, headers: Record<string, string>) =>
  call(r.handler, await asUser(null, r.method, r.path, undefined, headers), r.params);

describe("the origin check on every state-changing route", () => {
  it("finds the routes from app/api (the sign-in, sync and customer routes among them)", () => {
    const names = routes.map((r) => `${r.method} ${r.path}`);
    expect(names).toEqual(expect.arrayContaining(["POST /api/session", "POST /api/sync", "POST /api/customers"]));
    expect(names).toContain("DELETE /api/session");
    expect(routes.length).toBeGreaterThanOrEqual(25);
  });

  const refused = [
    ["a foreign Origin", { origin: FOREIGN }, FOREIGN],
    ["a foreign Referer and no Origin", { origin: "", referer: `${FOREIGN}/page` }, FOREIGN],
    ["Origin: null (a sandboxed frame)", { origin: "null" }, "a page with no address"],
    ["an own Referer under a foreign Origin", { origin: FOREIGN, referer: `${appOrigin()}/desk` }, FOREIGN],
    ["neither Origin nor Referer", { origin: "" }, "no Origin or Referer header"],
  ] as const;
  it.each(refused)("refuses %s with 403 in the envelope, before sign-in is even asked", async (_, headers, words) => {
    for (const r of routes) {
      const res = await send(r, headers);
      expect({ route: `${r.method} ${r.path}`, status: res.status }).toEqual({
        route: `${r.method} ${r.path}`,
        status: 403,
      });
      expect(res.body.error.code).toBe("forbidden");
      expect(res.body.error.message).toContain(words);
    }
  });

  const passed = [
    ["the app's own Origin", { origin: appOrigin() }],
    ["an own page as Referer when Origin is absent", { origin: "", referer: `${appOrigin()}/desk/jobs/1` }],
    ["a reverse proxy's origin listed in ALLOWED_ORIGINS", { origin: PROXY }],
    ["the second listed origin", { origin: "https://second.shop.example" }],
  ] as const;
  it.each(passed)("lets %s through to the route's own checks", async (_, headers) => {
    for (const r of routes) {
      const res = await send(r, headers);
      expect({ route: `${r.method} ${r.path}`, status: res.status }).not.toEqual({
        route: `${r.method} ${r.path}`,
        status: 403,
      });
      expect(res.status).toBeLessThan(500);
    }
  });
});

describe("JSON bodies", () => {
  let shop: TestShop;
  beforeAll(async () => {
    shop = await createShop();
  });
  const batch = () => JSON.stringify({ deviceId: "tablet-edge", readings: [] });

  it.each([
    ["text/plain (a form any page can send without asking)", "text/plain"],
    ["text/plain with a charset", "text/plain;charset=UTF-8"],
    ["a urlencoded form", "application/x-www-form-urlencoded"],
    ["no type at all", ""],
  ])("refuses a body sent as %s with 415", async (_, type) => {
    const { POST } = await import("@/app/api/sync/route");
    const headers = { "content-type": type };
    const res = await call(POST, await asUser(shop.users.machinist, "POST", "/api/sync", batch(), headers));
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe("unsupported_media");
    expect(res.body.error.message).toContain("Content-Type: application/json");
  });

  it("takes application/json with or without a charset", async () => {
    const { POST } = await import("@/app/api/sync/route");
    for (const type of ["application/json", "application/json; charset=utf-8", "Application/JSON;charset=UTF-8"]) {
      const res = await call(
        POST,
        await asUser(shop.users.machinist, "POST", "/api/sync", batch(), { "content-type": type }),
      );
      expect(res.status).toBe(200);
    }
  });

  it("refuses text/plain on a public route (sign-in) and an office route (a new customer) too", async () => {
    const { POST: signIn } = await import("@/app/api/session/route");
    const { POST: newCustomer } = await import("@/app/api/customers/route");
    const body = JSON.stringify({ email: shop.users.lead.email, password: "x", name: "Hollis Marine" });
    const plain = { "content-type": "text/plain" };
    expect((await call(signIn, await asUser(null, "POST", "/api/session", body, plain))).status).toBe(415);
    expect((await call(newCustomer, await asUser(shop.users.lead, "POST", "/api/customers", body, plain))).status).toBe(
      415,
    );
  });
});
