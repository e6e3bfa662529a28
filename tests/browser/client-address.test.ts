// The socket's address reaches the route handlers of a real `next start` (lib/server/core/
// peer-address.ts, installed by instrumentation.ts): sign-in failures are counted against it,
// whatever X-Forwarded-For or peer stamp the client writes (no TRUSTED_PROXIES here).
import { randomUUID } from "node:crypto";
import { request as playwrightRequest, type APIRequestContext } from "playwright-core";
import { Op } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSequelize, models } from "@/lib/server/core/db";
import { PEER_HEADER } from "@/lib/server/core/peer-address";
import { SIGN_IN_RULES } from "@/lib/server/users/sign-in-limits";
import { BASE_URL, sendJson } from "../support/browser";

let api: APIRequestContext;
beforeAll(async () => {
  api = await playwrightRequest.newContext({ baseURL: BASE_URL });
});
afterAll(async () => {
  await api?.dispose();
  await closeSequelize();
});

describe("client address on the running server", () => {
  it("counts failures against the socket's address, never a spoofed header, and does not let rotation escape", async () => {
    const email = `nobody-${randomUUID()}@nowhere.example`;
    const spoofed = (i: number) => ({ "x-forwarded-for": `203.0.113.${i}`, [PEER_HEADER]: `forged 198.51.100.${i}` });
    for (let i = 0; i < SIGN_IN_RULES.pair.limit; i++) {
      const res = await sendJson(api, "POST", "/api/session", { email, password: `guess-${i}` }, spoofed(i));
      expect(res.status()).toBe(401);
    }
    const locked = await sendJson(api, "POST", "/api/session", { email, password: "again" }, spoofed(99));
    expect(locked.status()).toBe(429);
    expect(Number(locked.headers()["retry-after"])).toBeGreaterThan(0);
    const { AuthThrottle } = models();
    const rows = await AuthThrottle.findAll({ where: { throttleKey: { [Op.like]: `signin:pair:${email}|%` } } });
    expect(rows.map((r) => [r.throttleKey, r.failures])).toEqual([[`signin:pair:${email}|127.0.0.1`, 5]]);
  });
});
