import { VerdictShape } from "@/components/ui/verdict-badge";

/** Pass or fail of a study: colour, word and shape (never colour alone), as every verdict on the bench. */
export function StudyPass({ pass, what = "" }: { pass: boolean; what?: string }) {
  const tone = pass ? "bg-pass-soft text-pass border-pass" : "bg-fail-soft text-fail border-fail";
  return (
    <span
      className={`inline-flex items-center gap-2 rounded-full border-2 px-3 py-1 text-sm font-semibold ${tone}`}
      data-pass={pass}
    >
      <VerdictShape verdict={pass ? "in_spec" : "out_of_spec"} size={15} />
      {pass ? "Passes" : "Fails"}
      {what ? ` ${what}` : ""}
    </span>
  );
}
