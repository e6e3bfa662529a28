import "server-only";
import { Sequelize } from "sequelize";
import * as modelClasses from "@/models";
import { databaseConfig, env } from "@/lib/server/core/env";

// The core's repo: the one Sequelize instance and the model classes bound to it. Outside the
// feature repos (lib/server/<feature>/repo.ts) this is the only file that imports models/, because
// binding the classes to the instance is what it is for.

// One Sequelize instance per process, kept on globalThis so dev hot reloads don't leak pools.
const holder = globalThis as unknown as { __tenthwiseSequelize?: Sequelize };

function instance(): Sequelize {
  if (!holder.__tenthwiseSequelize) {
    const cfg = databaseConfig();
    holder.__tenthwiseSequelize = new Sequelize(cfg.database, cfg.username, cfg.password, {
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
  return holder.__tenthwiseSequelize;
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
