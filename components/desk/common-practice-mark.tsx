"use client";

import { COMMON_PRACTICE_WORDS } from "@/lib/domain";

// The mark on a limit whose figures are a starter sheet's typical values. It goes on save when the
// limit's figures change; a lead who checked the maker's figure and found it the same takes it off
// with the button (lib/schemas/common-practice.ts).
export function CommonPracticeMark({ onConfirm }: { onConfirm?: () => void }) {
  return (
    <p
      className="flex flex-wrap items-center gap-2 rounded-tool border-l-4 border-watch bg-watch-soft p-2 text-sm"
      data-testid="common-practice"
    >
      <span className="font-semibold">{COMMON_PRACTICE_WORDS}.</span>
      <span>Changing a figure takes this mark off when you save.</span>
      {onConfirm && (
        <button
          type="button"
          className="min-h-11 rounded-tool border-2 border-rule px-3 font-medium"
          onClick={onConfirm}
        >
          Same as the maker&apos;s figure
        </button>
      )}
    </p>
  );
}
