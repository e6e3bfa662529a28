// One notifier's delivery on one database node, as a separate process (a second app instance):
// `tsx --conditions=react-server tests/cluster/support/mail-worker.ts` with DATABASE_URL naming the
// node and OUTBOX_IDS the messages to race for. It says "ready" once connected and begins at the
// first line on its stdin, so two workers begin together.
// Sending is faked (a short wait, as an SMTP server takes): the race is over the claims. Prints the
// ids this worker sent as JSON on its last line.
import { QueryTypes } from "sequelize";
import { deliverPendingMail } from "@/lib/server/mail/outbox-worker";
import { closeSequelize, getSequelize } from "@/lib/server/core/db";

const only = (process.env.OUTBOX_IDS ?? "").split(",").map(Number);

async function main() {
  await getSequelize().query("SELECT 1", { type: QueryTypes.SELECT });
  console.log("ready");
  await new Promise((r) => process.stdin.once("data", r));
  process.stdin.pause();
  const sent: number[] = [];
  const send = () => new Promise((r) => setTimeout(r, 5 + Math.random() * 15));
  // Until three passes in a row find nothing left to claim.
  for (let idle = 0; idle < 3;) {
    const report = await deliverPendingMail({ only, limit: 1000, budgetMs: 60_000, send });
    if (report.failed.length) throw new Error(`delivery failed: ${JSON.stringify(report.failed)}`);
    sent.push(...report.sent);
    idle = report.sent.length ? 0 : idle + 1;
    await new Promise((r) => setTimeout(r, 30));
  }
  await closeSequelize();
  console.log(JSON.stringify({ sent }));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
