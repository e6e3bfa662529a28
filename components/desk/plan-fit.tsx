"use client";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

// Why the plan's parts do not fit (the core's planFitWarnings), shown as the lead types; a save
// with any of them asks once more. The plan may still be saved: a builder can mean it.
export function PlanFitWarnings({
  warnings,
  asking,
  saving,
  onSave,
  onCancel,
}: {
  warnings: string[];
  asking: boolean;
  saving: boolean;
  onSave: () => void;
  onCancel: () => void;
}) {
  if (!warnings.length) return null;
  return (
    <>
      <Notice tone="caution" title="These parts do not fit as planned">
        <ul className="list-disc pl-5" data-testid="plan-fit-warnings">
          {warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      </Notice>
      {asking && (
        <section aria-labelledby="plan-fit-ask" className="flex flex-col gap-3 rounded-tool border-2 border-fail p-4">
          <h2 id="plan-fit-ask" className="text-lg font-semibold">
            Save a plan whose parts do not fit?
          </h2>
          <p>The plan is kept as written; check the parts on the engine itself before it is assembled.</p>
          <div className="flex flex-wrap gap-3">
            <Button type="button" big tone="danger" disabled={saving} onClick={onSave}>
              Save anyway
            </Button>
            <Button type="button" big tone="quiet" onClick={onCancel}>
              Keep editing
            </Button>
          </div>
        </section>
      )}
    </>
  );
}
