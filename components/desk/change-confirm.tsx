"use client";

import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { WIDE_CHANGE_FLAGS, type Consequences } from "@/lib/domain";
import { Field } from "./fields";

// What a change will do, shown before it is saved (counted by the server running the very save and
// rolling it back). A wide change asks again: the lead types the number of flags it opens, and the
// save carries that number, so the server saves only what was confirmed.
export function ChangeConfirm({
  what,
  preview,
  saving,
  onConfirm,
  onCancel,
}: {
  /** "Saving these limits", "Saving these sizes". */
  what: string;
  preview: { consequences: Consequences; words: string; wide: boolean };
  saving: boolean;
  onConfirm: (confirmedFlagsOpened: number | null) => void;
  onCancel: () => void;
}) {
  const [typed, setTyped] = useState("");
  const [error, setError] = useState<string>();
  const heading = useRef<HTMLHeadingElement>(null);
  const opened = preview.consequences.flagsOpened;
  const tone = preview.wide ? "border-fail bg-fail-soft" : "border-steel bg-panel";
  useEffect(() => heading.current?.focus(), []);
  const confirm = () => {
    if (!preview.wide) return onConfirm(null);
    if (typed.trim() !== String(opened)) {
      setError(`Type ${opened}, the number of flags this change opens, to save it`);
      return;
    }
    onConfirm(opened);
  };
  return (
    <section aria-labelledby="change-confirm-title" className={`flex flex-col gap-3 rounded-tool border-2 p-4 ${tone}`}>
      <h2 id="change-confirm-title" ref={heading} tabIndex={-1} className="text-lg font-semibold">
        Before you save
      </h2>
      <p role="status" className="text-lg" data-testid="change-consequences">
        {what} {preview.words}.
      </p>
      {preview.wide && (
        <Field
          label={`This opens more than ${WIDE_CHANGE_FLAGS} flags. Type ${opened} to confirm`}
          inputMode="numeric"
          autoComplete="off"
          value={typed}
          error={error}
          onChange={(e) => {
            setTyped(e.target.value);
            setError(undefined);
          }}
          onKeyDown={(e) => {
            if (e.key === "Enter") {
              e.preventDefault();
              confirm();
            }
          }}
        />
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="button" big tone={preview.wide ? "danger" : "primary"} disabled={saving} onClick={confirm}>
          {saving ? "Saving…" : "Confirm and save"}
        </Button>
        <Button type="button" big tone="quiet" disabled={saving} onClick={onCancel}>
          Keep editing
        </Button>
      </div>
    </section>
  );
}
