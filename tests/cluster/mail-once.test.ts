// Each queued mail is sent once however many notifiers run: two delivery workers, each on its own
// Galera node (separate processes, as two app instances), race over the same outbox.
import { spawn } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { enqueueMail } from "@/lib/server/mail/repo";
import { causalSelect, closeNodeDbs, everyNodeCaughtUp, nodeUrl, serverCodeOnNode } from "../support/cluster-nodes";
import { createShop, type TestShop } from "../support/factories";

serverCodeOnNode(2);

let s: TestShop;
beforeAll(async () => {
  s = await createShop();
});
afterAll(closeNodeDbs);

type Worker = { ready: Promise<void>; go: () => void; sent: Promise<number[]> };

/** A delivery worker on `node` (tests/cluster/support/mail-worker.ts), started and waiting for go(). */
function worker(node: number, ids: number[]): Worker {
  const child = spawn(
    "node",
    ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "tests/cluster/support/mail-worker.ts"],
    { env: { ...process.env, DATABASE_URL: nodeUrl(node), OUTBOX_IDS: ids.join(",") }, stdio: "pipe" },
  );
  let out = "";
  let err = "";
  let isReady: () => void = () => {};
  const ready = new Promise<void>((r) => (isReady = r));
  child.stdout.on("data", (d) => {
    out += d;
    if (out.includes("ready")) isReady();
  });
  child.stderr.on("data", (d) => (err += d));
  const sent = new Promise<number[]>((resolve, reject) =>
    child.on("exit", (code) => {
      isReady();
      if (code !== 0) return reject(new Error(`mail worker on node ${node} failed (${code}): ${err}`));
      resolve(JSON.parse(out.trim().split("\n").at(-1)!).sent);
    }),
  );
  return { ready, go: () => child.stdin.end("go\n"), sent };
}

describe("mail across instances", () => {
  it("two workers on two nodes racing over 60 messages send each exactly once", async () => {
    const tag = Date.now();
    for (let i = 0; i < 60; i++) {
      await enqueueMail(null, {
        shopId: s.shop.id,
        kind: "flag_digest",
        to: s.users.lead.email,
        subject: `Race ${tag} #${i}`,
        payload: { text: `Message ${i} of the race` },
        dedupeKey: `race:${tag}:${i}`,
      });
    }
    const rows = await causalSelect<{ id: number }>(2, "SELECT id FROM mail_outbox WHERE dedupe_key LIKE ?", [
      `race:${tag}:%`,
    ]);
    const ids = rows.map((r) => Number(r.id)).sort((a, b) => a - b);
    expect(ids).toHaveLength(60);
    await everyNodeCaughtUp();

    // Both begin at the same moment, once both processes are up and connected.
    const workers = [worker(0, ids), worker(1, ids)];
    await Promise.all(workers.map((w) => w.ready));
    for (const w of workers) w.go();
    const [onA, onB] = await Promise.all(workers.map((w) => w.sent));
    console.log(`[mail] node 1 sent ${onA.length}, node 2 sent ${onB.length}`);
    expect([...onA, ...onB].sort((a, b) => a - b)).toEqual(ids); // every one, none twice
    expect(onA.filter((id) => onB.includes(id))).toEqual([]);
    const unsent = await causalSelect<{ n: number }>(
      2,
      "SELECT COUNT(*) AS n FROM mail_outbox WHERE dedupe_key LIKE ? AND sent_at IS NULL",
      [`race:${tag}:%`],
    );
    expect(Number(unsent[0].n)).toBe(0);
  });
});
