// `npx tsx scripts/bench/profile-top.ts file.cpuprofile [rows]`: the functions of a V8 CPU profile
// that took the most time, by self time and by total (self and what they called), with their file.
import { readFileSync } from "node:fs";

type Node = {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
  hitCount?: number;
};
type Profile = { nodes: Node[]; samples: number[]; timeDeltas: number[]; startTime: number; endTime: number };

const [file, rowsArg] = process.argv.slice(2);
if (!file) throw new Error("Name a .cpuprofile file: npx tsx scripts/bench/profile-top.ts file.cpuprofile");
const p = JSON.parse(readFileSync(file, "utf8")) as Profile;
const byId = new Map(p.nodes.map((n) => [n.id, n]));
const parent = new Map<number, number>();
for (const n of p.nodes) for (const c of n.children ?? []) parent.set(c, n.id);

// Each sample's interval goes to its node (self) and, once per function, to every caller above it.
const self = new Map<string, number>();
const total = new Map<string, number>();
const key = (n: Node) =>
  `${n.callFrame.functionName || "(anonymous)"} ` +
  `${n.callFrame.url.replace(/^.*\/(lib|app|node_modules|scripts)\//, "$1/")}:${n.callFrame.lineNumber + 1}`;
p.samples.forEach((id, i) => {
  const dt = (p.timeDeltas[i + 1] ?? 0) / 1000;
  const k = key(byId.get(id)!);
  self.set(k, (self.get(k) ?? 0) + dt);
  const seen = new Set<string>();
  for (let at: number | undefined = id; at !== undefined; at = parent.get(at)) {
    const kk = key(byId.get(at)!);
    if (seen.has(kk)) continue;
    seen.add(kk);
    total.set(kk, (total.get(kk) ?? 0) + dt);
  }
});
const all = (p.endTime - p.startTime) / 1000;
const rows = Number(rowsArg ?? 30);
const top = (m: Map<string, number>, label: string) => {
  console.log(`${label} (of ${all.toFixed(0)} ms recorded)`);
  for (const [k, v] of [...m].sort((a, b) => b[1] - a[1]).slice(0, rows))
    console.log(`${v.toFixed(1).padStart(9)} ms ${((100 * v) / all).toFixed(1).padStart(5)} %  ${k}`);
};
top(self, "By self time");
top(total, "By total time");
