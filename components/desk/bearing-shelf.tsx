"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/client/api";
import { lengthWords } from "@/lib/domain";
import { WALL_SOURCE_WORDS } from "@/lib/schemas/bearing-enums";
import type { BearingsView, ShellView, StockLeft } from "@/lib/schemas/bearings";
import { ServerError } from "./fields";
import { bearingsKey } from "./queries";
import { setName } from "@/lib/schemas/bearing-words";

const REMOVE = "no-print min-h-11 rounded-tool border-2 border-rule px-3 text-sm font-semibold hover:border-fail";

// The shelf: each set with its wall, halves on hand, used by the choice on screen and left.

function wallWords(s: ShellView): string {
  const w = (x?: number | null) => (x == null ? "?" : lengthWords(x, s.unit));
  if (s.wallSource === "nominal") return `${w(s.wall)} (${WALL_SOURCE_WORDS.nominal.toLowerCase()})`;
  if (s.wallSource === "range") return `${w(s.wallMin)} to ${w(s.wallMax)}`;
  if (s.wallSource === "measured") return `upper ${w(s.wallUpper)}, lower ${w(s.wallLower)} (measured)`;
  return "from the standard set and the step";
}

export function BearingShelf({ view, stock }: { view: BearingsView; stock?: StockLeft[] }) {
  const qc = useQueryClient();
  const remove = useMutation({
    mutationFn: (id: number) =>
      api<BearingsView>(`/api/jobs/${view.job.id}/bearings/shells/${id}`, { method: "DELETE" }),
    onSuccess: (next) => qc.setQueryData(bearingsKey(view.job.id), next),
  });
  if (!view.shells.length) {
    return (
      <p className="rounded-tool border-2 border-dashed border-rule p-4 text-muted">No shells on the shelf yet.</p>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      <ul className="flex flex-col gap-2" aria-label="Shells on the shelf">
        {view.shells.map((s) => {
          const line = stock?.find((x) => x.shellId === s.id);
          const used = line?.used ?? s.used;
          const left = line?.left ?? { upper: s.halvesUpper - used.upper, lower: s.halvesLower - used.lower };
          const short = left.upper < 0 || left.lower < 0;
          return (
            <li
              key={s.id}
              className="flex flex-wrap items-center gap-x-4 gap-y-1 rounded-tool border-2 border-rule bg-panel p-3"
            >
              <span className="min-w-0 flex-1 font-semibold">
                <span className="font-mono text-muted">#{s.id}</span> {setName(s)}
              </span>
              <span className="text-sm">Wall {wallWords(s)}</span>
              <span className={`font-mono text-sm tabular ${short ? "font-bold text-fail" : ""}`}>
                {`upper ${used.upper} of ${s.halvesUpper} used, ${left.upper} left · `}
                {`lower ${used.lower} of ${s.halvesLower} used, ${left.lower} left`}
              </span>
              {!view.job.locked && (
                <button
                  type="button"
                  className={REMOVE}
                  onClick={() => remove.mutate(s.id)}
                  disabled={remove.isPending}
                >
                  Remove
                </button>
              )}
            </li>
          );
        })}
      </ul>
      <ServerError error={remove.error} />
    </div>
  );
}
