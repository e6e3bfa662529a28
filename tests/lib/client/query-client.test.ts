import { describe, expect, it } from "vitest";
import { ApiError } from "@/lib/client/api";
import { retryDelay, retryQuery } from "@/lib/client/query-client";

// While the server cannot reach its database (503 with Retry-After) an office screen keeps trying a
// few times, at the pace the server asked for, before it shows the error; anything else once.
describe("office queries during an outage", () => {
  const outage = new ApiError(503, "unavailable", "The server cannot reach its database", undefined, 5);
  const refused = new ApiError(422, "invalid", "Fix the query");

  it("retries a 503 or 429 a few times, anything else once", () => {
    expect([0, 1, 2, 3, 4].map((n) => retryQuery(n, outage))).toEqual([true, true, true, true, false]);
    expect([0, 1].map((n) => retryQuery(n, refused))).toEqual([true, false]);
    expect(retryQuery(0, new TypeError("Failed to fetch"))).toBe(true);
  });

  it("waits the server's Retry-After, else doubles from 1 s up to 30 s", () => {
    expect(retryDelay(1, outage)).toBe(5000);
    expect([0, 1, 2, 10].map((n) => retryDelay(n, refused))).toEqual([1000, 2000, 4000, 30_000]);
  });
});
