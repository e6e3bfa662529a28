import "server-only";
import { QueryTypes } from "sequelize";
import { getSequelize } from "@/lib/server/core/db";

// The health check's one door to the database: is the server there, and, on a Galera node, what
// its replication state is. Neither query needs a table right (SHOW STATUS is open to any account).
export type NodeProbe = { wsrepOn: boolean; state: string | null };

export async function probeNode(): Promise<NodeProbe> {
  const sequelize = getSequelize();
  const [on] = await sequelize.query<{ wsrepOn: number | string | null }>("SELECT @@wsrep_on AS wsrepOn", {
    type: QueryTypes.SELECT,
  });
  const wsrepOn = Number(on?.wsrepOn ?? 0) === 1;
  if (!wsrepOn) return { wsrepOn, state: null };
  const rows = await sequelize.query<{ Value: string }>("SHOW STATUS LIKE 'wsrep_local_state_comment'", {
    type: QueryTypes.SELECT,
  });
  return { wsrepOn, state: rows[0]?.Value ?? null };
}
