"use client";

import { Loading, LoadFailed } from "./fields";
import { useTemplate } from "./queries";
import { SpecTemplateForm } from "./spec-template-form";

export function SpecEdit({ templateId }: { templateId: number }) {
  const q = useTemplate(templateId);
  if (q.isPending) return <Loading what="the spec sheet" />;
  if (q.isError) return <LoadFailed what="the spec sheet" error={q.error} retry={() => q.refetch()} />;
  return (
    <>
      <div className="flex flex-wrap items-baseline gap-3">
        <h1 className="text-3xl font-semibold">{q.data.template.name}</h1>
        <span className="text-muted">
          version {q.data.template.version}
          {q.data.template.archived ? " · archived" : ""}
        </span>
        <a
          href={`/api/specs/${templateId}/export`}
          download
          className="ml-auto inline-flex min-h-11 items-center font-medium text-steel underline"
        >
          Export as a file
        </a>
      </div>
      <SpecTemplateForm template={q.data.template} jobCount={q.data.jobCount} />
    </>
  );
}
