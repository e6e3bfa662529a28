import "server-only";
import { z } from "zod";
import { parseProxyList, type ProxyList } from "@/lib/server/core/ip";

// The one place that reads process.env. Everything else imports `env`.
const optionalNumber = z.coerce.number().int().positive().optional();

// Proxies whose X-Forwarded-For is believed (lib/server/core/client-address.ts); empty: none.
const trustedProxies = z
  .string()
  .default("")
  .transform((text, ctx): ProxyList => {
    const parsed = parseProxyList(text);
    if ("list" in parsed) return parsed;
    ctx.addIssue({
      code: "custom",
      message: `"${parsed.bad}" is not an IP address or network; list addresses or CIDR networks, comma-separated`,
    });
    return z.NEVER;
  });

const schema = z
  .object({
    NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
    APP_URL: z.string().url().default("http://localhost:3000"),
    // Further origins whose pages may send changes (a reverse proxy's public address), comma-separated;
    // APP_URL's own origin is always allowed (lib/server/core/origin.ts).
    ALLOWED_ORIGINS: z
      .string()
      .default("")
      .transform((list, ctx) => {
        const origins: string[] = [];
        for (const item of list
          .split(",")
          .map((s) => s.trim())
          .filter(Boolean)) {
          const origin = URL.canParse(item) ? new URL(item).origin : "null";
          if (origin === "null" || origin !== item.replace(/\/$/, "").toLowerCase()) {
            ctx.addIssue({ code: "custom", message: `"${item}" is not an origin like https://tenthwise.example.com` });
          } else origins.push(origin);
        }
        return origins;
      }),
    DATABASE_URL: z
      .string()
      .regex(/^mariadb:\/\//, "DATABASE_URL must start with mariadb://")
      .optional(),
    DB_HOST: z.string().optional(),
    DB_PORT: optionalNumber,
    DB_NAME: z.string().optional(),
    DB_USER: z.string().optional(),
    DB_PASSWORD: z.string().optional(),
    // The schema's owner, for migrations and seeding only (same host and database as the app).
    // Unset: db-setup migrates as the app's account, as before the two accounts existed.
    DB_OWNER_USER: z
      .string()
      .optional()
      .transform((v) => v || undefined),
    DB_OWNER_PASSWORD: z.string().optional(),
    DB_POOL_MAX: z.coerce.number().int().positive().default(10),
    TRUSTED_PROXIES: trustedProxies,
    SESSION_SECRET: z.string().min(32, "SESSION_SECRET must be at least 32 characters"),
    SESSION_TTL_HOURS: z.coerce.number().positive().default(12),
    LINK_SECRET: z.string().min(32, "LINK_SECRET must be at least 32 characters").optional(),
    SMTP_HOST: z.string().default("127.0.0.1"),
    SMTP_PORT: z.coerce.number().int().positive().default(2525),
    SMTP_SECURE: z
      .enum(["true", "false"])
      .default("false")
      .transform((v) => v === "true"),
    SMTP_USER: z.string().optional(),
    SMTP_PASSWORD: z.string().optional(),
    MAIL_FROM: z.string().default("Tenthwise <records@tenthwise.local>"),
    MAIL_DIR: z.string().optional(),
    S3_ENDPOINT: z.string().url().optional(),
    S3_REGION: z.string().default("us-east-1"),
    S3_BUCKET: z.string().default("tenthwise"),
    S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
    S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
    S3_FORCE_PATH_STYLE: z
      .enum(["true", "false"])
      .default("true")
      .transform((v) => v === "true"),
    UPLOAD_MAX_BYTES: z.coerce
      .number()
      .int()
      .positive()
      .default(15 * 1024 * 1024),
    // Background mail: how often the notifier looks for new flags, ready jobs and releases
    // (0 turns the background worker off; runNotifierOnce() still works), and the retry backoff.
    NOTIFY_INTERVAL_SECONDS: z.coerce.number().int().min(0).default(180),
    MAIL_RETRY_BASE_SECONDS: z.coerce.number().positive().default(60),
    MAIL_MAX_ATTEMPTS: z.coerce.number().int().positive().default(8),
    LINK_TTL_DAYS: z.coerce.number().positive().default(30),
    // Where `npm run backup` puts its dated folders (relative to the working directory, or absolute).
    BACKUP_DIR: z.string().min(1).default("backups"),
    // Whether anyone may start a shop from the public page (/start); "off" for a host that makes
    // shops itself with `npm run shop:create`.
    PUBLIC_SIGNUP: z.enum(["on", "off"], { error: 'PUBLIC_SIGNUP is "on" or "off"' }).default("on"),
    // The build folder this server runs from (next.config.mjs distDir); /sw.js serves the
    // service worker built with that very build, so its precache list matches what is served.
    TW_DIST_DIR: z.string().min(1).default(".next"),
  })
  .refine((e) => e.DATABASE_URL || (e.DB_HOST && e.DB_NAME && e.DB_USER), {
    message: "Set DATABASE_URL, or DB_HOST, DB_NAME and DB_USER (npm start sets these for you)",
    path: ["DATABASE_URL"],
  });

export type Env = z.infer<typeof schema>;

function load(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Tenthwise configuration is invalid:\n${lines.join("\n")}`);
  }
  return parsed.data;
}

let cached: Env | undefined;

/** Validated environment, read once on first use (so a build without a database still works). */
export function env(): Env {
  cached ??= load();
  return cached;
}

export type DbAccountKind = "app" | "owner";

/** True when a separate owner account runs migrations (see lib/server/core/db-rights.ts). */
export const hasOwnerAccount = () => Boolean(env().DB_OWNER_USER);

/** Where and as whom to connect: the app's account, or the schema owner's when one is set. */
export function databaseConfig(kind: DbAccountKind = "app") {
  const base = appDatabaseConfig();
  const e = env();
  if (kind === "app" || !e.DB_OWNER_USER) return base;
  return { ...base, username: e.DB_OWNER_USER, password: e.DB_OWNER_PASSWORD ?? "" };
}

function appDatabaseConfig() {
  const e = env();
  if (e.DATABASE_URL) {
    const u = new URL(e.DATABASE_URL);
    return {
      host: u.hostname,
      port: u.port ? Number(u.port) : 3306,
      database: decodeURIComponent(u.pathname.replace(/^\//, "")),
      username: decodeURIComponent(u.username),
      password: decodeURIComponent(u.password),
    };
  }
  return {
    host: e.DB_HOST!,
    port: e.DB_PORT ?? 3306,
    database: e.DB_NAME!,
    username: e.DB_USER!,
    password: e.DB_PASSWORD ?? "",
  };
}

/** True while `next build` runs (Next sets NEXT_PHASE); background work must not start then. */
export const isBuildPhase = () => process.env.NEXT_PHASE === "phase-production-build";

/** Served over https in production: the cookie is Secure, browsers are told to keep to https (HSTS). */
export const servedOverHttps = () => env().NODE_ENV === "production" && env().APP_URL.startsWith("https:");

export const linkSecret = () => env().LINK_SECRET ?? `${env().SESSION_SECRET}:customer-links`;
