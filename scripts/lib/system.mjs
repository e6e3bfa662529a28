// System prerequisites: Debian packages the project needs, installed with apt-get when we are
// root, otherwise a message that says exactly what to install. Plain Node (runs before npm ci).
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync } from "node:fs";

const PACKAGES = {
  mariadbd: { pkg: "mariadb-server", paths: ["/usr/sbin/mariadbd", "/usr/bin/mariadbd"] },
  chromium: { pkg: "chromium", paths: ["/usr/bin/chromium"] },
  // The cluster (npm run cluster, npm run test:cluster): Galera's provider library, rsync for
  // state transfer, and HAProxy in front of the app instances.
  galera: { pkg: "galera-4", paths: ["/usr/lib/galera/libgalera_smm.so"] },
  rsync: { pkg: "rsync", paths: ["/usr/bin/rsync"] },
  haproxy: { pkg: "haproxy", paths: ["/usr/sbin/haproxy"] },
};

export function findBinary(name) {
  const known = PACKAGES[name]?.paths.find((p) => existsSync(p));
  if (known) return known;
  const r = spawnSync("sh", ["-c", `command -v ${name}`], { encoding: "utf8" });
  return r.status === 0 ? r.stdout.trim() : null;
}

export function ensureSystemPackages(names) {
  const missing = names.filter((n) => !findBinary(n));
  if (!missing.length) return;
  const pkgs = missing.map((n) => PACKAGES[n].pkg);
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (!isRoot) {
    console.error(
      `\nTenthwise needs these Debian packages: ${pkgs.join(" ")}\nInstall them with:\n` +
        `  sudo apt-get update && sudo apt-get install -y ${pkgs.join(" ")}\n`,
    );
    process.exit(1);
  }
  console.log(`[tenthwise] installing ${pkgs.join(", ")} with apt-get …`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", ...pkgs], { stdio: "inherit", env });
  // Debian starts its own mariadb service after install; we run our own private server instead.
  if (pkgs.includes("mariadb-server")) spawnSync("sh", ["-c", "service mariadb stop >/dev/null 2>&1 || true"]);
  // The same for HAProxy's service: ours runs with its own configuration on its own port.
  if (pkgs.includes("haproxy")) spawnSync("sh", ["-c", "service haproxy stop >/dev/null 2>&1 || true"]);
}
