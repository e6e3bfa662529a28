import "server-only";
import { Sequelize } from "sequelize";
import * as modelClasses from "@/models";
import { databaseConfig, env, type DbAccountKind } from "@/lib/server/core/env";

// The core's repo: the one Sequelize instance and the model classes bound to it. Outside the
// feature repos (lib/server/<feature>/repo.ts) this is the only file that imports models/, because
// binding the classes to the instance is what it is for.

// One Sequelize instance per process, kept on globalThis so dev hot reloads don't leak pools.
// The app connects as the app's account; db-setup switches the process to the owner's account
// (connectAsOwner) before its first query, so migrations and seeding run with the owner's rights.
const holder = globalThis as unknown as { __tenthwiseSequelize?: Sequelize; __tenthwiseAccount?: DbAccountKind };

/** A new Sequelize instance on the given account and database, by default the app's (the caller closes it). */
export function openSequelize(kind: DbAccountKind, database?: string): Sequelize {
  const cfg = databaseConfig(kind);
  return new Sequelize(database ?? cfg.database, cfg.username, cfg.password, {
    host: cfg.host,
    port: cfg.port,
    dialect: "mariadb",
    logging: false,
    pool: { max: env().DB_POOL_MAX, min: 0, idle: 10_000 },
    dialectOptions: { connectTimeout: 10_000 },
    timezone: "+00:00",
    define: { underscored: true },
  });
}

function instance(): Sequelize {
  holder.__tenthwiseSequelize ??= openSequelize(holder.__tenthwiseAccount ?? "app");
  return holder.__tenthwiseSequelize;
}

/** Scripts that change the schema or seed it call this before anything connects. */
export function connectAsOwner(): void {
  if (holder.__tenthwiseSequelize && holder.__tenthwiseAccount !== "owner") {
    throw new Error("connectAsOwner() must run before the first query");
  }
  holder.__tenthwiseAccount = "owner";
}

/**
 * The model classes, bound to the shared instance. Next bundles server code per route, so one
 * process can hold several copies of the classes; each copy is bound on its first use here
 * (initModels does nothing once done). Repos take their classes from this call.
 */
export function models(): typeof modelClasses {
  modelClasses.initModels(instance());
  return modelClasses;
}

/**
 * The shared instance, for transactions and raw SQL. The models are bound to it here too, so the
 * scripts and tests that use the classes directly find them ready.
 */
export function getSequelize(): Sequelize {
  const sequelize = instance();
  modelClasses.initModels(sequelize);
  return sequelize;
}

export async function closeSequelize(): Promise<void> {
  const s = holder.__tenthwiseSequelize;
  holder.__tenthwiseSequelize = undefined;
  if (s) await s.close();
}
