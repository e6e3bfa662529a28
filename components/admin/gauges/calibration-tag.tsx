import { StatusTag, type StatusTone } from "@/components/admin/status-tag";
import { CALIBRATION_WORDS, type CalibrationStatus } from "@/lib/schemas/instrument";

const TONE: Record<CalibrationStatus, StatusTone> = { in_calibration: "good", due_soon: "soon", past_due: "bad" };

function detail(status: CalibrationStatus, daysLeft: number): string {
  if (status === "past_due") return daysLeft === -1 ? "since yesterday" : `${-daysLeft} days over`;
  if (daysLeft === 0) return "due today";
  return daysLeft === 1 ? "1 day left" : `${daysLeft} days left`;
}

export function CalibrationTag({ status, daysLeft }: { status: CalibrationStatus; daysLeft: number }) {
  return (
    <span className="flex flex-col items-start gap-1">
      <StatusTag tone={TONE[status]}>{CALIBRATION_WORDS[status]}</StatusTag>
      <span className="text-xs text-muted">{detail(status, daysLeft)}</span>
    </span>
  );
}
