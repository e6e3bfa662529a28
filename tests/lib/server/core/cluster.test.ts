// The conflict retry every change-writing transaction runs under (lib/server/core/cluster.ts).
import { describe, expect, it } from "vitest";
import { causalSql, isConflict, withConflictRetry } from "@/lib/server/core/cluster";

/** An error as the mariadb driver reports it (Sequelize keeps it as `parent`). */
const dbError = (errno: number) => Object.assign(new Error(`errno ${errno}`), { parent: { errno } });

describe("withConflictRetry", () => {
  it("runs the transaction again after a deadlock or certification conflict (1213) and a lock wait timeout (1205)", async () => {
    const failures = [dbError(1213), dbError(1205), dbError(1213)];
    let calls = 0;
    const result = await withConflictRetry(async () => {
      calls += 1;
      const next = failures.shift();
      if (next) throw next;
      return "committed";
    });
    expect(result).toBe("committed");
    expect(calls).toBe(4);
  });

  it("gives up after its attempts and throws the last conflict", async () => {
    let calls = 0;
    const run = withConflictRetry(
      async () => {
        calls += 1;
        throw dbError(1213);
      },
      { attempts: 3 },
    );
    await expect(run).rejects.toThrow("errno 1213");
    expect(calls).toBe(3);
  });

  it("never runs again after another failure (a duplicate key, a refusal)", async () => {
    let calls = 0;
    const run = withConflictRetry(async () => {
      calls += 1;
      throw dbError(1062);
    });
    await expect(run).rejects.toThrow("errno 1062");
    expect(calls).toBe(1);
    expect(isConflict(dbError(1062))).toBe(false);
    expect(isConflict(new Error("no errno"))).toBe(false);
  });
});

describe("causalSql", () => {
  it("scopes wsrep_sync_wait to the one statement", () => {
    expect(causalSql("SELECT 1")).toBe("SET STATEMENT wsrep_sync_wait = 1 FOR SELECT 1");
  });
});
