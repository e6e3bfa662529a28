// Mounts the bench job screen the way /bench/job?id=… does in production: <BenchJob /> reads the
// job pack, the readings and the job's preferences from a real Dexie database (fake-indexeddb)
// through the same hooks (useDexieQuery, useAfterPaint), and refreshes the pack from
// GET /api/bench/jobs/:id once the screen has settled. Only the network and the sync engine are
// stand-ins: `fetch` answers with `serverPack`, the engine records its calls.
// Test files mock next/navigation's useSearchParams to read jsdom's address bar, which is set here.
import "fake-indexeddb/auto";
import { render, screen, waitFor } from "@testing-library/react";
import { expect, vi } from "vitest";
import { BenchProvider, type Bench } from "@/components/bench/bench-context";
import { BenchJob } from "@/components/bench/bench-job";
import { BenchDb } from "@/lib/offline/db";
import type { EngineHandle } from "@/lib/offline/engine-handle";
import { savePack } from "@/lib/offline/packs";
import type { JobPack } from "@/lib/schemas/sync";

let n = 0;

export async function mountBenchJob(
  pack: JobPack,
  o: { seed?: (db: BenchDb) => Promise<void>; serverPack?: JobPack } = {},
) {
  const db = new BenchDb(`bench-job-${++n}-${Date.now()}`);
  await savePack(db, pack);
  await o.seed?.(db);
  const server = vi.fn(async (url: RequestInfo | URL) =>
    String(url) === `/api/bench/jobs/${pack.job.id}`
      ? Response.json(o.serverPack ?? pack)
      : Response.json({ error: { code: "not_found", message: "Not found" } }, { status: 404 }),
  );
  vi.stubGlobal("fetch", server);
  window.history.replaceState(null, "", `/bench/job?id=${pack.job.id}`);
  const bench: Bench = {
    db,
    engine: { afterEntry: vi.fn(), sync: vi.fn() } as unknown as EngineHandle,
    deviceId: "tab-test",
    actor: { userId: 7, shopId: 1, name: "Rosa", email: "r@x.example", role: "machinist" },
  };
  render(
    <BenchProvider value={bench}>
      <BenchJob />
    </BenchProvider>,
  );
  const input = (await screen.findByTestId("entry")) as HTMLInputElement;
  await waitFor(() => expect(document.activeElement).toBe(input));
  return { db, bench, input, server };
}
