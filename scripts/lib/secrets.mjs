// Development secrets, generated once per checkout and kept in .data/ (never committed).
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { randomBytes } from "node:crypto";

export function localSecrets(file = ".data/secrets.json") {
  if (existsSync(file)) return JSON.parse(readFileSync(file, "utf8"));
  mkdirSync(".data", { recursive: true });
  const s = {
    SESSION_SECRET: randomBytes(32).toString("hex"),
    LINK_SECRET: randomBytes(32).toString("hex"),
    DB_APP_PASSWORD: randomBytes(12).toString("hex"),
  };
  writeFileSync(file, JSON.stringify(s, null, 2), { mode: 0o600 });
  return s;
}
