import type { ReactNode } from "react";

// Plain-language notices. "caution" is for safety text (torque, stretch, lifting, solvents).
const STYLES = {
  info: "border-steel bg-panel",
  caution: "border-watch bg-watch-soft",
  error: "border-fail bg-fail-soft",
} as const;

export function Notice({
  tone = "info",
  title,
  children,
}: {
  tone?: keyof typeof STYLES;
  title?: string;
  children: ReactNode;
}) {
  return (
    <div role={tone === "error" ? "alert" : "note"} className={`rounded-tool border-l-4 p-3 text-sm ${STYLES[tone]}`}>
      {title && <p className="mb-1 font-semibold">{title}</p>}
      <div>{children}</div>
    </div>
  );
}

export function FastenerCaution() {
  return (
    <Notice tone="caution" title="Caution: fasteners">
      Torque values, stretch figures and the lubricant come from the fastener or engine maker&apos;s instructions.
      Figures in Tenthwise record what was measured; they do not replace those instructions.
    </Notice>
  );
}
