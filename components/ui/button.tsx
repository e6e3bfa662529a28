import type { ButtonHTMLAttributes } from "react";

type Tone = "primary" | "accent" | "quiet" | "danger";
const TONES: Record<Tone, string> = {
  primary: "bg-steel text-steel-ink hover:brightness-110",
  accent: "bg-brass text-brass-ink hover:brightness-105",
  quiet: "bg-panel text-ink border-2 border-rule hover:border-muted",
  danger: "bg-fail text-white hover:brightness-110",
};

export function Button({
  tone = "primary",
  big = false,
  className = "",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone; big?: boolean }) {
  const size = big ? "min-h-16 min-w-16 px-6 text-lg" : "min-h-11 min-w-11 px-4 text-base";
  return (
    <button
      {...props}
      className={
        "inline-flex items-center justify-center gap-2 rounded-tool font-semibold disabled:opacity-50 " +
        `disabled:cursor-not-allowed ${size} ${TONES[tone]} ${className}`
      }
    />
  );
}
