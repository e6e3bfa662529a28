import { describe, expect, it, vi } from "vitest";

// The proxy this file's app sits behind; set before env.ts reads the environment.
vi.hoisted(() => {
  process.env.TRUSTED_PROXIES = "10.99.0.1";
});

import { randomUUID } from "node:crypto";
import { POST } from "@/app/api/session/route";
import { PEER_HEADER, stampFor } from "@/lib/server/core/peer-address";
import { SIGN_IN_RULES } from "@/lib/server/users/sign-in-limits";
import { createShop, TEST_PASSWORD } from "../support/factories";
import { asUser, call } from "../support/requests";

const PROXY = "10.99.0.1";
type From = { peer: string; forwardedFor?: string };
/** A client connecting straight to the app (its socket address is `peer`), writing any header it likes. */
const direct = (peer: string, forwardedFor?: string): From => ({ peer, forwardedFor });
/** A client behind the trusted proxy, which appends the address it saw to what the client wrote. */
const viaProxy = (client: string, spoofed?: string): From => ({
  peer: PROXY,
  forwardedFor: spoofed ? `${spoofed}, ${client}` : client,
});

let spoofs = 0;
const rotating = () => `203.0.113.${++spoofs % 250}`;

async function attempt(email: string, password: string, from: From) {
  const headers: Record<string, string> = { [PEER_HEADER]: stampFor(from.peer) };
  if (from.forwardedFor) headers["x-forwarded-for"] = from.forwardedFor;
  return call(POST, await asUser(null, "POST", "/api/session", { email, password }, headers));
}

async function fail(email: string, times: number, from: () => From) {
  const statuses: number[] = [];
  for (let i = 0; i < times; i++) statuses.push((await attempt(email, `wrong-${i}`, from())).status);
  return statuses;
}

function expectRetryAfter(res: { status: number; headers: Headers }, maxMinutes: number) {
  expect(res.status).toBe(429);
  const seconds = Number(res.headers.get("retry-after"));
  expect(seconds).toBeGreaterThan(0);
  expect(seconds).toBeLessThanOrEqual(maxMinutes * 60);
}

const PAIR = SIGN_IN_RULES.pair.limit;

describe("sign-in throttle: spoofed and trusted X-Forwarded-For", () => {
  it.each([
    ["a direct client rotating X-Forwarded-For", () => direct("192.0.2.10", rotating())],
    [
      "a client behind the proxy rotating what it writes left of the proxy's entry",
      () => viaProxy("198.51.100.10", rotating()),
    ],
  ])("%s does not escape the lock on its address", async (_what, from) => {
    const { users } = await createShop();
    expect(await fail(users.lead.email, PAIR, from)).toEqual(Array(PAIR).fill(401));
    // Even the right password from there now waits; the answer says how long.
    const locked = await attempt(users.lead.email, TEST_PASSWORD, from());
    expectRetryAfter(locked, SIGN_IN_RULES.pair.lockMinutes);
    expect(locked.body.error.code).toBe("too_many_attempts");
  });

  it.each([
    ["straight to the app", direct("192.0.2.11", "192.0.2.20"), direct("192.0.2.20")],
    ["through the proxy", viaProxy("198.51.100.11", "198.51.100.20"), viaProxy("198.51.100.20")],
  ])("an attacker naming the victim's address (%s) does not lock the victim out", async (_w, attacker, victim) => {
    const { users } = await createShop();
    await fail(users.inspector.email, PAIR + 2, () => attacker);
    expectRetryAfter(await attempt(users.inspector.email, TEST_PASSWORD, attacker), SIGN_IN_RULES.pair.lockMinutes);
    expect((await attempt(users.inspector.email, TEST_PASSWORD, victim)).status).toBe(200);
  });

  it("honours the trusted proxy: two clients behind it are counted apart", async () => {
    const { users } = await createShop();
    await fail(users.machinist.email, PAIR, () => viaProxy("198.51.100.12"));
    expect((await attempt(users.machinist.email, TEST_PASSWORD, viaProxy("198.51.100.12"))).status).toBe(429);
    expect((await attempt(users.machinist.email, TEST_PASSWORD, viaProxy("198.51.100.13"))).status).toBe(200);
  });

  it("counts failures sent at the same moment (as from several app instances) one by one", async () => {
    const { users } = await createShop();
    const from = direct("192.0.2.14");
    const all = await Promise.all(Array.from({ length: PAIR }, (_, i) => attempt(users.admin.email, `x${i}`, from)));
    expect(all.map((r) => r.status)).toEqual(Array(PAIR).fill(401));
    expect((await attempt(users.admin.email, TEST_PASSWORD, from)).status).toBe(429);
  });
});

describe("sign-in throttle: the account and the address", () => {
  it("lets the right password in from a clean address while the account is under attack", async () => {
    const { users } = await createShop();
    const email = users.lead.email;
    // A guesser spread over many addresses: each stays under the per-address limit.
    const spread = Array.from({ length: SIGN_IN_RULES.account.limit }, (_, i) => direct(`192.0.2.${100 + i}`));
    for (const from of spread) expect((await attempt(email, "guess", from)).status).toBe(401);
    // Now each address that has guessed is shut out of the account (one guess per address) ...
    expectRetryAfter(await attempt(email, "guess-again", spread[0]), SIGN_IN_RULES.account.lockMinutes);
    expectRetryAfter(await attempt(email, TEST_PASSWORD, spread[1]), SIGN_IN_RULES.account.lockMinutes);
    // ... while the owner, from an address that has not failed, still gets in.
    expect((await attempt(email, TEST_PASSWORD, direct("192.0.2.250"))).status).toBe(200);
  });

  it("gives made-up e-mails a higher per-address limit that keeps out no real account's right password", async () => {
    const { users } = await createShop();
    const from = direct("192.0.2.30");
    const madeUp = () => `nobody-${randomUUID()}@nowhere.example`;
    for (let i = 0; i < SIGN_IN_RULES.address.limit - 1; i++) {
      expect((await attempt(madeUp(), "x", from)).status).toBe(401);
    }
    const last = await attempt(madeUp(), "x", from);
    expectRetryAfter(last, SIGN_IN_RULES.address.lockMinutes);
    expectRetryAfter(await attempt(madeUp(), "x", from), SIGN_IN_RULES.address.lockMinutes);
    // A real account's wrong password gets the same answer as a made-up e-mail (nothing to tell them apart) ...
    const wrong = await attempt(users.lead.email, "not-it", from);
    expect(wrong.status).toBe(429);
    expect(wrong.body).toEqual(last.body);
    // ... and its right password still gets in from that address.
    expect((await attempt(users.machinist.email, TEST_PASSWORD, from)).status).toBe(200);
  }, 60_000);

  it.each([
    ["a made-up e-mail", `nobody-${randomUUID()}@nowhere.example`],
    ["the longest e-mail the form takes (191 characters)", `${"n".repeat(150)}-${randomUUID()}@x.example`.slice(-191)],
  ])("locks %s from one address just as a real one, so the lock tells nothing", async (_what, email) => {
    const from = direct("192.0.2.31");
    expect(await fail(email, PAIR, () => from)).toEqual(Array(PAIR).fill(401));
    expectRetryAfter(await attempt(email, "x", from), SIGN_IN_RULES.pair.lockMinutes);
  });

  it("forgives an address its own mistakes once its owner signs in", async () => {
    const { users } = await createShop();
    const from = direct("192.0.2.32");
    await fail(users.lead.email, PAIR - 1, () => from);
    expect((await attempt(users.lead.email, TEST_PASSWORD, from)).status).toBe(200);
    expect(await fail(users.lead.email, PAIR - 1, () => from)).toEqual(Array(PAIR - 1).fill(401));
    expect((await attempt(users.lead.email, TEST_PASSWORD, from)).status).toBe(200);
  });
});
