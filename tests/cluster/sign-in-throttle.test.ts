// Sign-in throttling counts across app instances: wrong passwords sent in turn through the two
// instances (each on its own Galera node) add up to one count, and the lock holds on both.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SIGN_IN_RULES } from "@/lib/server/users/sign-in-limits";
import { closeNodeDbs, everyNodeCaughtUp, http, serverCodeOnNode } from "../support/cluster-nodes";
import { createShop, TEST_PASSWORD, type TestShop } from "../support/factories";

serverCodeOnNode(2);

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
  await everyNodeCaughtUp();
});
afterAll(closeNodeDbs);

// The instances trust the proxy on 127.0.0.1 (TRUSTED_PROXIES), so the client is the address named here.
const signIn = (app: number, password: string, client: string) =>
  http(app, null, "POST", "/api/session", { email: s.users.lead.email, password }, { "x-forwarded-for": client });

describe("sign-in throttle across instances", () => {
  it("adds failures sent through both instances and locks the pair on both", async () => {
    const client = "192.0.2.77";
    const statuses = [];
    for (let i = 0; i < SIGN_IN_RULES.pair.limit; i++)
      statuses.push((await signIn(i % 2, `wrong-${i}`, client)).status);
    expect(statuses).toEqual(Array(SIGN_IN_RULES.pair.limit).fill(401));
    // Neither instance alone saw the limit; together they did, so even the right password waits.
    expect((await signIn(0, TEST_PASSWORD, client)).status).toBe(429);
    expect((await signIn(1, TEST_PASSWORD, client)).status).toBe(429);
    // Another address is not held up by this one's lock.
    expect((await signIn(1, TEST_PASSWORD, "192.0.2.78")).status).toBe(200);
  });
});
