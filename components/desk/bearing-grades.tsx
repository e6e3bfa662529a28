"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import { BEARING_ROLE_WORDS, type GradeTable } from "@/lib/domain";
import { AreaField, Loading, LoadFailed, ServerError } from "./fields";

// The shop's factory grade tables (housing code × journal code → shell grade): imported from a
// file in our documented JSON (format tenthwise.bearing-grades, docs/bearing-grades.md), or pasted.
// A file that is refused stays in the box with the words saying what to fix.

type Listed = { tables: { id: number; name: string; table: GradeTable; updatedAt: string }[] };
const KEY = ["bearing-grades"] as const;

export function BearingGrades({ canEdit }: { canEdit: boolean }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: KEY, queryFn: () => api<Listed>("/api/bearing-grades") });
  const [text, setText] = useState("");
  const [parseError, setParseError] = useState<string | null>(null);
  const upload = useMutation({
    mutationFn: (json: unknown) => api<Listed & { imported: number }>("/api/bearing-grades", { method: "POST", json }),
    onSuccess: (next) => qc.setQueryData(KEY, next),
  });
  const remove = useMutation({
    mutationFn: (id: number) => api<Listed>(`/api/bearing-grades/${id}`, { method: "DELETE" }),
    onSuccess: (next) => qc.setQueryData(KEY, next),
  });
  const send = () => {
    try {
      setParseError(null);
      upload.mutate(JSON.parse(text));
    } catch {
      setParseError("This is not JSON: check for a missing comma, quote or bracket.");
    }
  };
  if (q.isPending) return <Loading what="the grade tables" />;
  if (q.isError) return <LoadFailed what="the grade tables" error={q.error} retry={() => void q.refetch()} />;
  return (
    <div className="flex flex-col gap-4">
      {q.data.tables.length === 0 && <p className="text-muted">No grade tables yet.</p>}
      <ul className="flex flex-col gap-2" aria-label="Grade tables">
        {q.data.tables.map(({ id, name, table }) => (
          <li key={id} className="flex flex-wrap items-center gap-3 rounded-tool border-2 border-rule bg-panel p-3">
            <span className="flex-1 font-semibold">{name}</span>
            <span className="text-sm">
              {BEARING_ROLE_WORDS[table.role]} · {table.grades.length} grades · {table.cells.length} cells ·{" "}
              {table.unit}
            </span>
            {canEdit && (
              <Button tone="quiet" onClick={() => remove.mutate(id)} disabled={remove.isPending}>
                Remove
              </Button>
            )}
          </li>
        ))}
      </ul>
      {canEdit && (
        <section aria-labelledby="grades-import" className="flex flex-col gap-2">
          <h2 id="grades-import" className="text-xl font-semibold">
            Import a grade table file
          </h2>
          <label className="inline-flex min-h-11 items-center gap-2 text-sm font-medium">
            Choose a file
            <input
              type="file"
              accept="application/json,.json"
              className="min-h-11"
              onChange={async (e) => {
                const f = e.target.files?.[0];
                if (f) setText(await f.text());
              }}
            />
          </label>
          <AreaField label="Or paste the file here" rows={10} value={text} onChange={(e) => setText(e.target.value)} />
          {parseError && <Notice tone="error">{parseError}</Notice>}
          <ServerError error={upload.error} />
          {upload.isSuccess && <Notice title="Imported">{upload.data.imported} table(s) saved.</Notice>}
          <Button onClick={send} disabled={upload.isPending || !text.trim()} className="self-start">
            Import
          </Button>
        </section>
      )}
    </div>
  );
}
