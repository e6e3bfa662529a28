// Development secrets, generated once per checkout and kept in .data/ (never committed).
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { randomBytes } from "node:crypto";

const KEYS = ["SESSION_SECRET", "LINK_SECRET", "DB_APP_PASSWORD", "DB_OWNER_PASSWORD"];
const fresh = (key) => randomBytes(key.startsWith("DB_") ? 12 : 32).toString("hex");

/** The checkout's secrets; a key added since the file was written is generated and kept too. */
export function localSecrets(file = ".data/secrets.json") {
  const known = existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : {};
  if (KEYS.every((k) => known[k])) return known;
  mkdirSync(".data", { recursive: true });
  const s = { ...Object.fromEntries(KEYS.map((k) => [k, fresh(k)])), ...known };
  writeFileSync(file, JSON.stringify(s, null, 2), { mode: 0o600 });
  return s;
}
