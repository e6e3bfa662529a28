"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api, ApiError } from "@/lib/client/api";
import { SPEC_FILE_FORMAT, templateFileSchema } from "@/lib/schemas/spec";
import { keys, type TemplateRecord } from "./queries";

// Import a spec sheet file (our own format, lib/schemas/spec.ts). The file is checked here with
// the same schema the server uses, so every problem is listed with where it is and what to fix.
type Problem = { path: string; message: string };

/** "template.limits.3.max" → "template.limits[3].max (limit 4)". */
export function pathWords(path: string): string {
  if (!path || path === "_") return "the file";
  const parts = path.split(".");
  const text = parts.map((p, i) => (/^\d+$/.test(p) ? `[${p}]` : `${i ? "." : ""}${p}`)).join("");
  const at = parts.indexOf("limits");
  const n = at >= 0 && /^\d+$/.test(parts[at + 1] ?? "") ? ` (limit ${Number(parts[at + 1]) + 1})` : "";
  return `${text}${n}`;
}

function check(text: string): { ok: true; value: unknown } | { ok: false; problems: Problem[] } {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    return {
      ok: false,
      problems: [
        { path: "", message: `This is not JSON: ${(err as Error).message}. Paste the whole file, from { to }.` },
      ],
    };
  }
  const parsed = templateFileSchema.safeParse(json);
  if (parsed.success) return { ok: true, value: parsed.data };
  return { ok: false, problems: parsed.error.issues.map((i) => ({ path: i.path.join("."), message: i.message })) };
}

export function SpecImport() {
  const [text, setText] = useState("");
  const [problems, setProblems] = useState<Problem[]>([]);
  const qc = useQueryClient();
  const router = useRouter();
  const upload = useMutation({
    mutationFn: (value: unknown) =>
      api<{ template: TemplateRecord }>("/api/specs/import", { method: "POST", json: value }),
    onSuccess: async ({ template }) => {
      await qc.invalidateQueries({ queryKey: keys.specs });
      router.push(`/desk/specs/${template.id}`);
    },
    onError: (err) => {
      if (err instanceof ApiError && err.fields)
        setProblems(Object.entries(err.fields).flatMap(([path, msgs]) => msgs.map((message) => ({ path, message }))));
      else
        setProblems([
          { path: "", message: err instanceof Error ? err.message : "The server did not answer; try again." },
        ]);
    },
  });
  const onFile = async (file: File | undefined) => file && setText(await file.text());
  const submit = () => {
    const r = check(text);
    setProblems(r.ok ? [] : r.problems);
    if (r.ok) upload.mutate(r.value);
  };
  return (
    <div className="flex flex-col gap-4">
      <Notice title="What this reads">
        A Tenthwise spec sheet file: JSON with{" "}
        <span className="font-mono">&quot;format&quot;: &quot;{SPEC_FILE_FORMAT}&quot;</span> and{" "}
        <span className="font-mono">&quot;version&quot;: 1</span>, then{" "}
        <span className="font-mono">&quot;template&quot;</span> with the sheet&apos;s name, engine type, build, units
        and its limits. Each limit names its characteristic, stations, limit type and unit, the figures that type needs,
        and whether it is required. Export any sheet to see a complete file. Importing makes a new sheet; it never
        changes an existing sheet or a job.
      </Notice>
      <label className="flex flex-col gap-1 font-medium">
        Choose a file
        <input
          type="file"
          accept="application/json,.json"
          onChange={(e) => onFile(e.target.files?.[0])}
          className="min-h-11"
        />
      </label>
      <label className="flex flex-col gap-1 font-medium">
        …or paste it here
        <textarea
          value={text}
          onChange={(e) => setText(e.target.value)}
          rows={14}
          spellCheck={false}
          className="rounded-tool border-2 border-rule bg-paper p-3 font-mono text-sm"
        />
      </label>
      {problems.length > 0 && (
        <Notice
          tone="error"
          title={`Not imported: ${problems.length} ${problems.length === 1 ? "thing" : "things"} to fix`}
        >
          <ul className="list-disc pl-5">
            {problems.map((p, i) => (
              <li key={i}>
                <span className="font-mono">{pathWords(p.path)}</span>: {p.message}
              </li>
            ))}
          </ul>
        </Notice>
      )}
      <div>
        <Button big onClick={submit} disabled={!text.trim() || upload.isPending}>
          {upload.isPending ? "Importing…" : "Check and import"}
        </Button>
      </div>
    </div>
  );
}
