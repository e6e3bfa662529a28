"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { api } from "@/lib/client/api";
import { Loading, LoadFailed, ServerError } from "./fields";
import { keys, useTemplates, type TemplateRecord, type TemplateSummary } from "./queries";

// The shop's spec sheets, current ones first; archived sheets can be restored.
function ArchiveButton({ t }: { t: TemplateSummary }) {
  const qc = useQueryClient();
  const toggle = useMutation({
    mutationFn: () =>
      api<{ template: TemplateRecord }>(`/api/specs/${t.id}`, { method: "PATCH", json: { archived: !t.archived } }),
    onSuccess: ({ template }) => {
      qc.setQueryData(keys.specs, (old: TemplateSummary[] | undefined) =>
        old?.map((x) => (x.id === t.id ? { ...x, archived: template.archived } : x)),
      );
      qc.setQueryData(keys.spec(t.id), (old: { jobCount: number } | undefined) => (old ? { ...old, template } : old));
    },
  });
  return (
    <>
      <button
        type="button"
        onClick={() => toggle.mutate()}
        disabled={toggle.isPending}
        className="min-h-11 rounded-tool border-2 border-rule px-3 text-sm font-medium hover:border-muted"
      >
        {toggle.isPending ? "…" : t.archived ? "Restore" : "Archive"}
      </button>
      {toggle.error && <ServerError error={toggle.error} />}
    </>
  );
}

function Row({ t }: { t: TemplateSummary }) {
  return (
    <tr className="border-t border-rule">
      <td className="px-3 py-3">
        <Link
          href={`/desk/specs/${t.id}`}
          className="inline-flex min-h-11 items-center font-semibold text-steel underline-offset-2 hover:underline"
        >
          {t.name}
        </Link>
        {t.archived && <span className="ml-2 rounded-tool border border-rule px-1 text-xs">archived</span>}
      </td>
      <td className="px-3 py-3">{t.engineKind}</td>
      <td className="px-3 py-3">{t.buildKind}</td>
      <td className="px-3 py-3">{t.unitSystem === "mm" ? "Metric" : "Inch"}</td>
      <td className="px-3 py-3 text-right tabular">{t.limitCount}</td>
      <td className="px-3 py-3 text-right tabular">{t.version}</td>
      <td className="px-3 py-3">
        <span className="flex flex-wrap items-center gap-2">
          <a
            href={`/api/specs/${t.id}/export`}
            download
            className="min-h-11 content-center rounded-tool border-2 border-rule px-3 text-sm font-medium hover:border-muted"
          >
            Export
          </a>
          <ArchiveButton t={t} />
        </span>
      </td>
    </tr>
  );
}

export function SpecList() {
  const list = useTemplates();
  if (list.isPending) return <Loading what="the spec sheets" />;
  if (list.isError) return <LoadFailed what="the spec sheets" error={list.error} retry={() => list.refetch()} />;
  if (list.data.length === 0)
    return (
      <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
        No spec sheets yet. Create one, or import a sheet file.
      </p>
    );
  return (
    <div className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
      <table className="w-full border-collapse text-left">
        <thead className="bg-paper text-sm">
          <tr>
            <th scope="col" className="px-3 py-2">
              Sheet
            </th>
            <th scope="col" className="px-3 py-2">
              Engine type
            </th>
            <th scope="col" className="px-3 py-2">
              Build
            </th>
            <th scope="col" className="px-3 py-2">
              Units
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Limits
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Version
            </th>
            <th scope="col" className="px-3 py-2">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {list.data.map((t) => (
            <Row key={t.id} t={t} />
          ))}
        </tbody>
      </table>
    </div>
  );
}
