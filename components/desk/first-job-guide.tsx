"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { api } from "@/lib/client/api";
import type { Role } from "@/lib/schemas/enums";
import type { GuideState, GuideStep } from "@/lib/schemas/shop";

// The first-job guide: four steps from an empty shop to the first reading, each linking to the
// screen where it is done and ticked once the shop has done it (wherever it was done). It stays
// on the desk until the first reading is logged. A step the viewer's role cannot do says who does.
type Step = { title: string; what: string; href: string | null; action: string };

function stepsFor(role: Role, firstJobId: number | null): Record<GuideStep, Step> {
  const admin = role === "admin";
  return {
    gauge: {
      title: "Add a gauge",
      what: "Register the micrometers, bore gauges, feelers and torque wrenches the bench uses, with serials and ranges.",
      href: admin ? "/admin/gauges" : null,
      action: admin ? "Open Gauges" : "Your shop's admin adds gauges",
    },
    sheet: {
      title: "Pick or import a spec sheet",
      what:
        "Three starter sheets are ready with typical figures marked common practice: open one and put in the " +
        "maker's figures, or import a sheet file of your own.",
      href: "/desk/specs",
      action: "Open Spec sheets",
    },
    job: {
      title: "Create a job",
      what: "Name the customer and the engine, state the finished sizes, and choose the sheet the job copies.",
      href: admin ? "/admin/users" : "/desk/jobs/new",
      action: admin ? "A lead creates jobs: invite one in Users" : "New job",
    },
    bench: {
      title: "Open it on the bench",
      what: "On the tablet, sign in as a machinist or the lead, open the job and log its first reading.",
      href: admin ? null : firstJobId ? `/bench/${firstJobId}` : "/bench",
      action: admin
        ? "A machinist or the lead does this on the bench"
        : firstJobId
          ? "Open the job on the bench"
          : "Open the bench",
    },
  };
}

function Tick({ done }: { done: boolean }) {
  return (
    <span
      aria-hidden="true"
      className={`flex h-9 w-9 shrink-0 items-center justify-center rounded-full border-2 text-lg font-bold ${
        done ? "border-pass bg-pass-soft text-pass" : "border-rule text-muted"
      }`}
    >
      {done ? "✓" : ""}
    </span>
  );
}

export function FirstJobGuide({ role }: { role: Role }) {
  const guide = useQuery({ queryKey: ["shop-guide"], queryFn: () => api<GuideState>("/api/shops/guide") });
  if (!guide.data || guide.data.done.bench) return null;
  const steps = stepsFor(role, guide.data.firstJobId);
  const order = Object.keys(steps) as GuideStep[];
  const doneCount = order.filter((k) => guide.data.done[k]).length;
  return (
    <section
      aria-labelledby="guide-title"
      className="rounded-tool border-2 border-steel bg-panel p-4"
      data-testid="guide"
    >
      <h2 id="guide-title" className="text-xl font-semibold">
        From an empty shop to the first reading
      </h2>
      <p className="text-sm text-muted">
        {doneCount} of {order.length} steps done. This guide goes once the first reading is logged.
      </p>
      <ol className="mt-3 flex flex-col gap-3">
        {order.map((k, i) => {
          const s = steps[k];
          const done = guide.data.done[k];
          return (
            <li key={k} className="flex gap-3" data-step={k} data-done={done}>
              <Tick done={done} />
              <div className="flex flex-col gap-1">
                <p className="font-semibold">
                  {i + 1}. {s.title}
                  <span className={done ? "ml-2 text-pass" : "ml-2 text-muted"}>{done ? "· done" : "· to do"}</span>
                </p>
                <p className="text-sm">{s.what}</p>
                {s.href ? (
                  <Link className="inline-flex min-h-11 items-center font-medium text-steel underline" href={s.href}>
                    {s.action}
                  </Link>
                ) : (
                  <p className="text-sm text-muted">{s.action}</p>
                )}
              </div>
            </li>
          );
        })}
      </ol>
    </section>
  );
}
