import { afterEach, describe, expect, it, vi } from "vitest";
import { ConnectionRefusedError, DatabaseError } from "sequelize";
import { asPageError } from "@/lib/server/core/access";
import { DB_UNAVAILABLE_DIGEST } from "@/lib/schemas/errors";

// A page whose database is out of reach throws an error carrying the digest app/error.tsx
// recognises (Next keeps a digest the error already has), so the page says so calmly.
afterEach(() => vi.restoreAllMocks());

describe("asPageError", () => {
  it("marks an outage with the digest the error screen reads, logging one line", () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const err = asPageError(new ConnectionRefusedError(Object.assign(new Error("refused"), { code: "ECONNREFUSED" })));
    expect(err).toMatchObject({ digest: DB_UNAVAILABLE_DIGEST });
    expect(log).toHaveBeenCalledTimes(1);
  });

  it("leaves any other error as it was", () => {
    const other = new DatabaseError(Object.assign(new Error("syntax"), { errno: 1064, sql: "" }) as never);
    expect(asPageError(other)).toBe(other);
  });
});
