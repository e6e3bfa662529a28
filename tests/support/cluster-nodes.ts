// Direct access to each Galera node and each app instance of the cluster `npm run test:cluster`
// started (tests/support/cluster.ts has the addresses): this test process's own server code on a
// chosen node, plain SQL on any node, and HTTP requests to one instance as a signed-in person.
import { QueryTypes, Sequelize } from "sequelize";
import { appOrigin } from "@/lib/server/core/origin";
import { cluster } from "./cluster";
import type { TestUser } from "./factories";
import { cookieFor } from "./requests";

/** The app account's address of node i. */
export function nodeUrl(i: number): string {
  const { nodes, db } = cluster();
  const who = `${encodeURIComponent(db.user)}:${encodeURIComponent(db.password)}`;
  return `mariadb://${who}@127.0.0.1:${nodes[i].port}/${db.database}`;
}

/**
 * Points this test process's server code (lib/server, the factories) at node i, as a third app
 * instance would be. Call it before the first query: the connection is made once per test file.
 */
export function serverCodeOnNode(i: number): void {
  process.env.DATABASE_URL = nodeUrl(i);
}

const connections = new Map<number, Sequelize>();

/** A Sequelize of its own on node i (the app account), for plain SQL and held transactions there. */
export function nodeDb(i: number): Sequelize {
  let db = connections.get(i);
  if (!db)
    connections.set(i, (db = new Sequelize(nodeUrl(i), { dialect: "mariadb", logging: false, timezone: "+00:00" })));
  return db;
}

/** Rows read on node i once it has applied every commit the cluster had made (wsrep_sync_wait). */
export function causalSelect<T extends object>(i: number, sql: string, replacements: unknown[] = []): Promise<T[]> {
  return nodeDb(i).query<T>(`SET STATEMENT wsrep_sync_wait = 1 FOR ${sql}`, { replacements, type: QueryTypes.SELECT });
}

/** One statement on node i (autocommit). */
export async function onNode(i: number, sql: string, replacements: unknown[] = []): Promise<void> {
  await nodeDb(i).query(sql, { replacements, type: QueryTypes.RAW });
}

/** A Galera status counter of node i (e.g. wsrep_local_cert_failures). */
export async function nodeStatus(i: number, name: string): Promise<number> {
  const [row] = await nodeDb(i).query<{ Value: string }>(`SHOW GLOBAL STATUS LIKE ?`, {
    replacements: [name],
    type: QueryTypes.SELECT,
  });
  return Number(row?.Value ?? 0);
}

/** Waits until every node has applied every commit made so far (what this process wrote, say). */
export async function everyNodeCaughtUp(): Promise<void> {
  for (let i = 0; i < cluster().nodes.length; i++) await causalSelect(i, "SELECT 1 AS one");
}

export async function closeNodeDbs(): Promise<void> {
  for (const db of connections.values()) await db.close();
  connections.clear();
}

const cookies = new Map<number, string>();

/**
 * A signed-in session of `user`, opened once (on this process's node); call everyNodeCaughtUp
 * before the first request, so the instance's node already has the session.
 */
export async function sessionCookie(user: TestUser): Promise<string> {
  let cookie = cookies.get(user.id);
  if (!cookie) cookies.set(user.id, (cookie = await cookieFor(user)));
  return cookie;
}

export type HttpReply = { status: number; body: any }; // eslint-disable-line @typescript-eslint/no-explicit-any

/**
 * A request to app instance `app` as a browser on the app's pages sends it: the session cookie of
 * `user` (null: signed out) and, on a change, the app's Origin. `headers` adds or overrides.
 */
export async function http(
  app: number,
  user: TestUser | null,
  method: string,
  path: string,
  body?: unknown,
  headers: Record<string, string> = {},
): Promise<HttpReply> {
  const h: Record<string, string> = { ...headers };
  if (user) h.cookie = await sessionCookie(user);
  if (method !== "GET") h.origin ??= appOrigin();
  if (body !== undefined) h["content-type"] ??= "application/json";
  const res = await fetch(`${cluster().apps[app].url}${path}`, {
    method,
    headers: h,
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  let parsed: unknown = text;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    // not JSON: the text as it came
  }
  return { status: res.status, body: parsed };
}
