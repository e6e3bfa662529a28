"use client";

import { useQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import type { JobMaps, Profile } from "@/lib/schemas/readings";
import { Legend } from "./chart-parts";
import { DeckCard } from "./deck-card";
import { ProfileCard } from "./profile-card";

function Section({
  title,
  note,
  profiles,
  unit,
  upright,
}: {
  title: string;
  note: string;
  profiles: Profile[];
  unit: string;
  upright: boolean;
}) {
  if (!profiles.length) return null;
  return (
    <section className="flex flex-col gap-3 print:break-before-auto" aria-label={title}>
      <div>
        <h2 className="text-2xl font-semibold">{title}</h2>
        <p className="text-sm text-muted">{note}</p>
      </div>
      <div className="grid gap-3 [grid-template-columns:repeat(auto-fill,minmax(20rem,1fr))] print:grid-cols-2">
        {profiles.map((p) => (
          <ProfileCard key={p.label} p={p} unit={unit} upright={upright} />
        ))}
      </div>
    </section>
  );
}

export function MapsView({ jobId }: { jobId: number }) {
  const q = useQuery({ queryKey: ["maps", jobId], queryFn: () => api<JobMaps>(`/api/jobs/${jobId}/maps`) });
  if (q.isPending) return <p className="text-muted">Loading the maps…</p>;
  if (q.isError)
    return (
      <Notice tone="error" title="Could not load the maps">
        {q.error.message}
      </Notice>
    );
  const m = q.data;
  const unit = m.unit === "mm" ? "mm" : "in";
  return (
    // On paper the charts' lines print in near-black (app/globals.css, [data-print="maps"]); the
    // page's policy runs no inline <style>, so the rule lives with the other print rules.
    <div className="flex flex-col gap-8" data-print="maps">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="flex flex-col gap-1">
          <p className="font-mono text-sm text-muted">{m.job.code}</p>
          <h1 className="text-3xl font-semibold">Bore and journal maps · {m.job.title}</h1>
          <p className="text-sm text-muted">
            Current figures in {unit}
            {m.corrected ? ", brought to 20 °C where a part temperature was entered" : ""}. Taper is the spread along
            one axis; out-of-round the gap between the axes at one place.
          </p>
        </div>
        <Button tone="quiet" className="no-print" onClick={() => window.print()}>
          Print
        </Button>
      </div>
      <Legend a="Axis A" b="Axis B" />
      <Section
        title="Cylinder bores"
        note="Top of the bore at the top. Axis A is the thrust axis, B the pin axis."
        profiles={m.bores}
        unit={unit}
        upright
      />
      <Section
        title="Main journals"
        note="Front end left, rear end right; axes A and B 90° apart."
        profiles={m.mains}
        unit={unit}
        upright={false}
      />
      <Section
        title="Rod journals"
        note="Front end left, rear end right; axes A and B 90° apart."
        profiles={m.rods}
        unit={unit}
        upright={false}
      />
      <section className="flex flex-col gap-3" aria-label="Deck height">
        <h2 className="text-2xl font-semibold">Deck height</h2>
        <DeckCard corners={m.deck} unit={unit} />
      </section>
    </div>
  );
}
