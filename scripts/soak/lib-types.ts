// The plain-JS helpers of scripts/lib (shared with npm test and npm run cluster), with the types
// the soak and the burst bench rely on. Imported by computed path: the .mjs files carry no types.
export interface GaleraNode {
  name: string;
  port: number;
  socket: string;
  pid: number | null;
}
export interface Cluster {
  nodes: GaleraNode[];
  kill(i: number): Promise<void>;
  restart(i: number): Promise<void>;
  stop(): Promise<void>;
}
export interface Apps {
  apps: { url: string; port: number; pid: number }[];
  kill(i: number): Promise<void>;
  restart(i: number): Promise<void>;
  stop(): Promise<void>;
}
export type Env = Record<string, string | undefined>;
export interface Lib {
  startServices(o: Record<string, unknown>): Promise<{ env: Record<string, string>; stop(): Promise<void> }>;
  startApps(o: { count: number; env: Env; dbFor?(i: number): Env }): Promise<Apps>;
  startClusterStack(o: {
    dataRoot: string;
    secrets: Record<string, string>;
    proxyPort: number;
    instances: number;
    distDir: string;
    mode: "test" | "start";
    extraEnv: Env;
    log(line: string): void;
  }): Promise<{
    galera: Cluster;
    apps: Apps;
    proxy: { url: string };
    env: Env;
    restartNode(i: number): Promise<void>;
    restartApp(i: number): Promise<void>;
    stop(): Promise<void>;
  }>;
  withoutOwnerAccount(env: Env): Env;
  freePort(): Promise<number>;
  ensureBuild(o: { perVersion: boolean }): string;
}

const path = (name: string) => `../lib/${name}.mjs`;

/** Every helper the soak needs, from its module under scripts/lib. */
export async function lib(): Promise<Lib> {
  const names = ["services", "app-instances", "cluster-stack", "db-accounts", "ports", "build"];
  const mods = await Promise.all(names.map((n) => import(path(n))));
  return Object.assign({}, ...mods) as Lib;
}
