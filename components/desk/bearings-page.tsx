"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import { lockedJobWords } from "@/lib/domain";
import type { BearingsView, ChoiceInput, PointProposal, SelectionAnswer } from "@/lib/schemas/bearings";
import { BearingPickList } from "./bearing-pick-list";
import { BearingPointRow, type HousingDraft } from "./bearing-point-row";
import { BearingShelf } from "./bearing-shelf";
import { ShellForm } from "./bearing-shell-form";
import { Loading, LoadFailed, ServerError } from "./fields";
import { bearingsKey, useBearings } from "./queries";

// The lead's bearing selection for one job: the shelf, each point in a row (housing bores typed
// here, halves chosen by the selection or by hand), what a change moves before it is saved, and
// a pick list to print.

const draftsOf = (v: BearingsView): Record<string, HousingDraft> =>
  Object.fromEntries(
    v.points.map((p) => [
      p.point,
      {
        housingBore: p.housingBore?.toString() ?? "",
        housingGaugeId: p.housingGaugeId?.toString() ?? "",
        thrust: p.thrust,
        housingCode: p.housingCode ?? "",
        journalCode: p.journalCode ?? "",
      },
    ]),
  );
const savedChoice = (v: BearingsView): PointProposal[] =>
  v.points.map((p) => ({
    point: p.point,
    upperShellId: p.upperShellId,
    lowerShellId: p.lowerShellId,
    predicted: p.predicted,
    mixed: p.upperShellId !== p.lowerShellId,
  }));

export function BearingsPage({ jobId }: { jobId: number }) {
  const q = useBearings(jobId);
  if (q.isPending) return <Loading what="the bearings" />;
  if (q.isError) return <LoadFailed what="the bearings" error={q.error} retry={() => void q.refetch()} />;
  return <Loaded view={q.data} />;
}

function Loaded({ view }: { view: BearingsView }) {
  const qc = useQueryClient();
  const id = view.job.id;
  const [drafts, setDrafts] = useState(() => draftsOf(view));
  const [choice, setChoice] = useState(() => savedChoice(view));
  const [byHand, setByHand] = useState<Set<string>>(
    () => new Set(view.points.filter((p) => p.byHand).map((p) => p.point)),
  );
  const [answer, setAnswer] = useState<SelectionAnswer | null>(null);
  const body = (c: PointProposal[], hand: Set<string>): ChoiceInput => ({
    points: c.map((x) => ({
      point: x.point,
      upperShellId: x.upperShellId,
      lowerShellId: x.lowerShellId,
      byHand: hand.has(x.point),
    })),
  });
  const refresh = (next: BearingsView) => qc.setQueryData(bearingsKey(id), next);
  const housings = useMutation({
    mutationFn: () =>
      api<BearingsView>(`/api/jobs/${id}/bearings/housings`, {
        method: "PUT",
        json: {
          points: view.points.map((p) => {
            const d = drafts[p.point];
            const bore = d.housingBore.trim();
            return {
              point: p.point,
              housingBore: bore === "" ? null : Number(bore),
              housingGaugeId: d.housingGaugeId ? Number(d.housingGaugeId) : null,
              thrust: d.thrust,
              housingCode: d.housingCode.trim() || null,
              journalCode: d.journalCode.trim() || null,
            };
          }),
        },
      }),
    onSuccess: refresh,
  });
  const merge = (a: SelectionAnswer, c: PointProposal[]) =>
    c.map((x) => a.points.find((p) => p.point === x.point) ?? { ...x, predicted: null });
  const select = useMutation({
    mutationFn: () => api<SelectionAnswer>(`/api/jobs/${id}/bearings/select`, { method: "POST" }),
    onSuccess: (a) => {
      setAnswer(a);
      setChoice((c) => merge(a, c));
      setByHand(new Set());
    },
  });
  const preview = useMutation({
    mutationFn: (c: PointProposal[]) =>
      api<SelectionAnswer>(`/api/jobs/${id}/bearings/choice/preview`, { method: "POST", json: body(c, byHand) }),
    onSuccess: (a) => {
      setAnswer(a);
      setChoice((c) => merge(a, c));
    },
  });
  const save = useMutation({
    mutationFn: () =>
      api<SelectionAnswer>(`/api/jobs/${id}/bearings/choice`, { method: "PUT", json: body(choice, byHand) }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: bearingsKey(id) }),
  });
  const choose = (point: string, half: "upperShellId" | "lowerShellId", shell: number | null) => {
    const next = choice.map((c) => (c.point === point ? { ...c, [half]: shell } : c));
    setChoice(next);
    setByHand((h) => new Set(h).add(point));
    preview.mutate(next);
  };
  const locked = view.job.locked;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1 print:hidden">
        <h1 className="text-2xl font-semibold">
          Bearing shells · {view.job.code} {view.job.title}
        </h1>
        <p className="text-muted">
          Enter the sets on hand and each housing bore, then let the selection pick halves that put every journal in its
          window. Figures in {view.job.unit}.
        </p>
      </header>
      {locked && (
        <Notice title="Locked">
          {lockedJobWords({ status: view.job.status, locked: true }, "its shells and bearing choice")}
        </Notice>
      )}
      <section aria-labelledby="shelf-title" className="flex flex-col gap-3 print:hidden">
        <h2 id="shelf-title" className="text-xl font-semibold">
          Shells on the shelf
        </h2>
        <BearingShelf view={view} stock={answer?.stock} />
        {!locked && <ShellForm view={view} />}
      </section>
      <section aria-labelledby="points-title" className="flex flex-col gap-3 print:hidden">
        <h2 id="points-title" className="text-xl font-semibold">
          Journals and halves
        </h2>
        <ul className="flex flex-col gap-2">
          {view.points.map((p) => (
            <BearingPointRow
              key={p.point}
              view={view}
              p={p}
              draft={drafts[p.point]}
              onDraft={(d) => setDrafts({ ...drafts, [p.point]: d })}
              choice={choice.find((c) => c.point === p.point)}
              onChoose={(half, shell) => choose(p.point, half, shell)}
            />
          ))}
        </ul>
        {!locked && (
          <div className="flex flex-wrap gap-3">
            <Button tone="quiet" onClick={() => housings.mutate()} disabled={housings.isPending}>
              Save housing bores
            </Button>
            <Button onClick={() => select.mutate()} disabled={select.isPending}>
              {select.isPending ? "Selecting…" : "Run the selection"}
            </Button>
            <Button onClick={() => save.mutate()} disabled={save.isPending || !!answer?.problems.length}>
              Save this choice
            </Button>
            <Button tone="quiet" onClick={() => window.print()}>
              Print the pick list
            </Button>
          </div>
        )}
        {[housings.error, select.error, preview.error, save.error].map((e, i) => (
          <ServerError key={i} error={e} />
        ))}
        {save.isSuccess && <Notice title="Saved">The choice is saved on the job and shows on the bench.</Notice>}
        <AnswerNotes answer={answer} />
      </section>
      <BearingPickList view={view} choice={choice} />
    </div>
  );
}

function AnswerNotes({ answer }: { answer: SelectionAnswer | null }) {
  if (!answer) return null;
  const list = (items: string[]) => (
    <ul className="list-disc pl-5">
      {items.map((m) => (
        <li key={m}>{m}</li>
      ))}
    </ul>
  );
  return (
    <div className="flex flex-col gap-2">
      {answer.problems.length > 0 && (
        <Notice tone="error" title="The rules refuse this choice">
          {list(answer.problems)}
        </Notice>
      )}
      <Notice title="What moves against the saved choice">
        {answer.moved.length ? list(answer.moved) : <p>Nothing: this is the saved choice.</p>}
      </Notice>
      {answer.advice.length > 0 && <Notice title="Still to do">{list(answer.advice)}</Notice>}
    </div>
  );
}
