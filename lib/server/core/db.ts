import "server-only";
import { Sequelize } from "sequelize";
import { initModels } from "@/models";
import { databaseConfig, env } from "@/lib/server/core/env";

// One Sequelize instance per process, kept on globalThis so dev hot reloads don't leak pools.
const holder = globalThis as unknown as { __tenthwiseSequelize?: Sequelize };

export function getSequelize(): Sequelize {
  if (!holder.__tenthwiseSequelize) {
    const cfg = databaseConfig();
    const sequelize = new Sequelize(cfg.database, cfg.username, cfg.password, {
      host: cfg.host,
      port: cfg.port,
      dialect: "mariadb",
      logging: false,
      pool: { max: env().DB_POOL_MAX, min: 0, idle: 10_000 },
      dialectOptions: { connectTimeout: 10_000 },
      timezone: "+00:00",
      define: { underscored: true },
    });
    holder.__tenthwiseSequelize = sequelize;
  }
  // Next bundles server code per route, so one process can hold several copies of the model
  // classes; each copy must be bound to the shared instance. initModels is a no-op when done.
  initModels(holder.__tenthwiseSequelize);
  return holder.__tenthwiseSequelize;
}

export async function closeSequelize(): Promise<void> {
  const s = holder.__tenthwiseSequelize;
  holder.__tenthwiseSequelize = undefined;
  if (s) await s.close();
}
