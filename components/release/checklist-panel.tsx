"use client";

import Link from "next/link";
import { useState } from "react";
import { StatusTag } from "@/components/admin/status-tag";
import { SECTION_LABELS, type SectionId } from "@/lib/domain";
import type { ChecklistCheck, ChecklistItem, ReleaseChecklist } from "@/lib/schemas/release";

// The release checklist: each of the five checks with what is complete, and every unmet item in
// words with the link that fixes it. Long lists fold: stations to read are grouped by bench
// section (a fresh V8 has over 200), other checks show the first few.
const FOLD = 6;

function Item({ item }: { item: ChecklistItem }) {
  return (
    <li className="flex flex-wrap items-baseline gap-x-3 text-sm" data-item={item.key}>
      <span>{item.text}</span>
      {item.links.map((l) => (
        <Link
          key={l.href}
          href={l.href}
          className="inline-flex min-h-11 items-center whitespace-nowrap font-medium text-steel underline"
        >
          {l.label}
        </Link>
      ))}
    </li>
  );
}

/** Items keyed "readings:<station id>" grouped by the station's section, in route order. */
function bySection(items: ChecklistItem[]): [string, ChecklistItem[]][] {
  const groups = new Map<string, ChecklistItem[]>();
  for (const item of items) {
    const section = item.key.split(":")[1]?.split("/")[0] ?? "";
    groups.set(section, [...(groups.get(section) ?? []), item]);
  }
  return [...groups.entries()];
}

function Sections({ items }: { items: ChecklistItem[] }) {
  return (
    <ul className="ml-6 flex flex-col gap-1.5 border-l-4 border-fail pl-3">
      {bySection(items).map(([section, group]) => (
        <li key={section}>
          <details>
            <summary className="min-h-11 cursor-pointer py-2.5 text-sm font-medium">
              {SECTION_LABELS[section as SectionId] ?? section}: {group.length}{" "}
              {group.length === 1 ? "station" : "stations"}
            </summary>
            <ul className="mt-1 flex flex-col gap-1.5 pl-4">
              {group.map((item) => (
                <Item key={item.key} item={item} />
              ))}
            </ul>
          </details>
        </li>
      ))}
    </ul>
  );
}

function Check({ check, n }: { check: ChecklistCheck; n: number }) {
  const [open, setOpen] = useState(false);
  const shown = open ? check.items : check.items.slice(0, FOLD);
  return (
    <li
      className="flex flex-col gap-2 border-t-2 border-rule py-3 first:border-t-0"
      data-check={check.id}
      data-ok={check.ok}
    >
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <span className="font-mono text-sm text-muted">{n}</span>
        <StatusTag tone={check.ok ? "good" : "bad"}>{check.ok ? "Complete" : "Blocking"}</StatusTag>
        <span className="font-semibold">{check.title}</span>
      </div>
      <p
        className="pl-6 text-sm text-muted"
        data-testid={check.progress ? "required-progress" : undefined}
        data-done={check.progress?.done}
        data-required={check.progress?.required}
      >
        {check.summary}
      </p>
      {check.id === "readings" && check.items.length > FOLD && <Sections items={check.items} />}
      {check.items.length > 0 && !(check.id === "readings" && check.items.length > FOLD) && (
        <ul className="ml-6 flex flex-col gap-1.5 border-l-4 border-fail pl-3">
          {shown.map((item) => (
            <Item key={item.key} item={item} />
          ))}
          {check.items.length > FOLD && (
            <li>
              <button
                type="button"
                className="min-h-11 text-sm font-semibold text-steel underline"
                onClick={() => setOpen(!open)}
                aria-expanded={open}
              >
                {open ? "Show fewer" : `Show all ${check.items.length}`}
              </button>
            </li>
          )}
        </ul>
      )}
    </li>
  );
}

export function ChecklistPanel({ checklist }: { checklist: ReleaseChecklist }) {
  const blocking = checklist.unmet.length;
  return (
    <section aria-labelledby="checklist-h" className="rounded-tool border-2 border-rule bg-panel p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="checklist-h" className="text-xl font-semibold">
          Release checklist
        </h2>
        <p className="font-semibold" data-testid="checklist-state">
          {blocking === 0
            ? "Nothing blocks release"
            : `${blocking} ${blocking === 1 ? "item blocks" : "items block"} release`}
        </p>
      </div>
      <ol className="mt-2">
        {checklist.checks.map((c, i) => (
          <Check key={c.id} check={c} n={i + 1} />
        ))}
      </ol>
    </section>
  );
}
