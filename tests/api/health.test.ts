import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/health/route";
import { call } from "../support/requests";

// npm test's MariaDB is one server without Galera: reachable is all the health check asks of it.
describe("GET /api/health", () => {
  it("answers 200 without a sign-in and says nothing beyond up, reachable and the node's kind", async () => {
    const res = await call(GET, new Request("http://localhost/api/health"));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok", database: "reachable", node: "single" });
    expect(res.headers.get("cache-control")).toBe("no-store");
  });
});
