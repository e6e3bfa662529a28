// The layout's import boundaries are enforced by ESLint (eslint.config.mjs). Each case lints a
// small source text as if it sat at the given path, so a weakened rule makes these fail.
import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

let eslint: ESLint;
// The first lint loads the config and the TypeScript parser (seconds on a busy machine); done here
// with room to spare, so each case's own time limit measures only its lint.
beforeAll(async () => {
  eslint = new ESLint({ cwd: process.cwd() });
  await eslint.lintText("export {};\n", { filePath: "lib/domain/warm-up.ts" });
}, 60_000);

async function problems(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.map((m) => m.ruleId ?? m.message);
}

const refused = [
  ["the core importing server code", "lib/domain/x.ts", 'import { env } from "@/lib/server/core/env";\nenv();\n'],
  ["the core importing React", "lib/domain/x.ts", 'import { useState } from "react";\nuseState();\n'],
  ["the core importing the offline store", "lib/domain/x.ts", 'import { db } from "@/lib/offline/db";\ndb();\n'],
  ["a component importing a repo", "components/x.tsx", 'import { r } from "@/lib/server/jobs/repo";\nr();\n'],
  ["a hook importing models", "hooks/use-x.ts", 'import { Job } from "@/models";\nJob.init();\n'],
  ["the offline store importing server code", "lib/offline/x.ts", 'import { r } from "../server/jobs/repo";\nr();\n'],
  [
    "a client component under app/ importing server code",
    "app/(office)/x/thing.tsx",
    '"use client";\nimport { r } from "@/lib/server/jobs/repo";\nr();\n',
  ],
  [
    "a server file other than a repo importing models",
    "lib/server/jobs/board.ts",
    'import { Job } from "@/models";\nJob.init();\n',
  ],
  ["a route importing models", "app/api/x/route.ts", 'import { Job } from "@/models";\nJob.init();\n'],
  [
    "a core feature folder importing server code",
    "lib/domain/bearings/x.ts",
    'import { env } from "@/lib/server/core/env";\nenv();\n',
  ],
  [
    "a core feature folder reaching out of the core",
    "lib/domain/bearings/x.ts",
    'import { r } from "../../server/jobs/repo";\nr();\n',
  ],
] as const;

describe("import boundaries", () => {
  it.each(refused)("refuses %s", async (_what, path, code) => {
    const found = await problems(path, code);
    expect(found.some((id) => id === "no-restricted-imports" || id === "tenthwise/clientBoundary")).toBe(true);
  });

  it("lets a feature's repo import models and the core import its own files", async () => {
    expect(await problems("lib/server/jobs/repo.ts", 'import { Job } from "@/models";\nJob.init();\n')).toEqual([]);
    expect(await problems("lib/domain/x.ts", 'import { toMm } from "./units";\ntoMm(1, "in");\n')).toEqual([]);
    const upOne = 'import { toMm } from "../units";\ntoMm(1, "in");\n';
    expect(await problems("lib/domain/bearings/x.ts", upOne)).toEqual([]);
  });
});
