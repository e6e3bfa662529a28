// While the database is out of reach every route answers 503 with Retry-After (header and envelope),
// never 500, and the routes work again once it is back. The app talks to the test MariaDB through a
// TCP relay this test owns, so "the database goes away" is the relay dropping every connection and
// refusing new ones, as a restart or a failover looks from the app, without stopping the shared server.
import { createServer, connect, type Server, type Socket } from "node:net";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as JOBS } from "@/app/api/jobs/route";
import { POST as NEW_CUSTOMER } from "@/app/api/customers/route";
import { GET as FEED, POST as PUSH } from "@/app/api/sync/route";
import { closeSequelize } from "@/lib/server/core/db";
import { createShop, gaugeFor, type TestShop } from "../support/factories";
import { asUser, call } from "../support/requests";

class Relay {
  private server: Server | null = null;
  private readonly sockets = new Set<Socket>();
  constructor(
    private readonly target: { host: string; port: number },
    readonly port = 0,
  ) {}

  async up(): Promise<number> {
    this.server = createServer((client) => {
      const upstream = connect(this.target.port, this.target.host);
      for (const s of [client, upstream]) {
        this.sockets.add(s);
        s.on("close", () => this.sockets.delete(s));
        s.on("error", () => s.destroy());
      }
      client.pipe(upstream).pipe(client);
    });
    await new Promise<void>((r) => this.server!.listen(this.port, "127.0.0.1", r));
    (this as { port: number }).port = (this.server.address() as { port: number }).port;
    return this.port;
  }

  /** Drops every open connection and refuses new ones. */
  async down(): Promise<void> {
    const server = this.server;
    this.server = null;
    for (const s of this.sockets) s.destroy();
    if (server) await new Promise((r) => server.close(r));
  }
}

const realUrl = process.env.DATABASE_URL!;
let relay: Relay;
let a: TestShop;

beforeAll(async () => {
  const u = new URL(realUrl);
  relay = new Relay({ host: u.hostname, port: Number(u.port || 3306) });
  const port = await relay.up();
  await closeSequelize();
  // Read by env() on its first use in this file, so the app's one Sequelize instance goes through the relay.
  process.env.DATABASE_URL = Object.assign(new URL(realUrl), { port: String(port) }).toString();
  a = await createShop();
});

afterAll(async () => {
  await closeSequelize();
  process.env.DATABASE_URL = realUrl;
  await relay.down();
});

const reading = (jobId: number) => ({
  id: crypto.randomUUID(),
  jobId,
  stationId: "bore/1/top/A",
  value: 4.0305,
  unit: "in",
  instrumentId: gaugeFor(a.shop.id, "bore/1/top/A"),
  takenAt: "2026-12-03T09:00:00Z",
});

/** A few routes of every kind: a read, a desk write, the tablet's pull and push. */
async function requests() {
  const lead = a.users.lead;
  return [
    ["GET /api/jobs", JOBS, await asUser(lead, "GET", "/api/jobs")],
    ["POST /api/customers", NEW_CUSTOMER, await asUser(lead, "POST", "/api/customers", { name: "Harbour Marine" })],
    ["GET /api/sync", FEED, await asUser(lead, "GET", `/api/sync?since=0&jobs=${a.job.id}`)],
    [
      "POST /api/sync",
      PUSH,
      await asUser(lead, "POST", "/api/sync", { deviceId: "tablet-1", readings: [reading(a.job.id)] }),
    ],
  ] as const;
}

async function expectOk(name: string, handler: unknown, req: Request) {
  const res = await call(handler as never, req);
  expect({ name, ok: res.status < 300, body: res.status < 300 ? null : res.body }).toEqual({
    name,
    ok: true,
    body: null,
  });
}

describe("database outage", () => {
  it("answers 503 with Retry-After on every route while the database is away, then recovers", async () => {
    // The cookies are made while the database is there (a sign-in needs it).
    const before = await requests();
    const during = await requests();
    const after = await requests();
    for (const [name, handler, req] of before) await expectOk(name, handler, req);

    await relay.down();
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    try {
      for (const [name, handler, req] of during) {
        const res = await call(handler as never, req);
        expect({ name, status: res.status }).toEqual({ name, status: 503 });
        const wait = Number(res.headers.get("Retry-After"));
        expect(wait).toBeGreaterThan(0);
        expect(res.body.error).toMatchObject({ code: "unavailable", retryAfter: wait });
        expect(res.body.error.message).toMatch(/cannot reach its database/);
      }
      // One structured line per refused request, no stack traces.
      const lines = log.mock.calls.map((c) => JSON.parse(String(c[0])));
      expect(lines.every((l) => l.event === "db_unavailable")).toBe(true);
    } finally {
      log.mockRestore();
    }

    await relay.up();
    for (const [name, handler, req] of after) await expectOk(name, handler, req);
  });
});
