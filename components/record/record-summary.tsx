import { FastenerCaution, Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import type { BuildRecord } from "@/lib/schemas/record";
import { COMMON_PRACTICE_WORDS } from "@/lib/domain";

// The customer's summary of a build record (the PDF has every figure): who, what, the release,
// the tally by verdict, each decision on something outside its limits, the torque records.
function ReleaseState({ record }: { record: BuildRecord }) {
  const r = record.release!;
  if (r.status === "void") {
    return (
      <div className="flex flex-col gap-2 rounded-tool border-4 border-fail bg-panel p-4" data-testid="release-state">
        <p className="text-5xl font-black tracking-widest text-fail">VOID</p>
        <p className="text-xl font-semibold">This record was withdrawn on {r.voidedAt}: the shop reopened the job.</p>
        <p>Reason: {r.voidReason ?? "none given"}.</p>
        <p className="font-semibold">
          Do not assemble the engine from this record. When the job is released again, {record.shop.name} sends a new
          record.
        </p>
        <p className="text-sm text-muted">
          It was signed by {r.inspectorName}, inspector, on {r.signedAt}.
        </p>
      </div>
    );
  }
  return (
    <div className="rounded-tool border-4 border-steel bg-panel p-4" data-testid="release-state">
      <p className="text-xl font-semibold">Released for assembly</p>
      <p>
        Signed by {r.inspectorName}, inspector, on {r.signedAt}.
      </p>
      <p className="mt-2 text-sm text-muted">
        Fingerprint (SHA-256): <span className="break-all font-mono">{r.hash}</span>
      </p>
      <p className="text-sm text-muted">{r.check.words}</p>
    </div>
  );
}

function Tally({ record }: { record: BuildRecord }) {
  const t = record.tally;
  return (
    <ul className="flex flex-wrap gap-3" aria-label="Readings by verdict">
      <li className="flex items-center gap-2">
        <VerdictBadge verdict="in_spec" /> <span className="tabular">{t.inSpec}</span>
      </li>
      <li className="flex items-center gap-2">
        <VerdictBadge verdict="marginal" /> <span className="tabular">{t.marginal}</span>
      </li>
      <li className="flex items-center gap-2">
        <VerdictBadge verdict="out_of_spec" /> <span className="tabular">{t.outOfSpec}</span>
      </li>
      {t.skipped > 0 && <li className="text-muted">{t.skipped} skipped</li>}
    </ul>
  );
}

export function RecordSummary({ record }: { record: BuildRecord }) {
  const decided = record.flags.filter((f) => f.decisions.length > 0);
  return (
    <div className="flex flex-col gap-6">
      <ReleaseState record={record} />
      <section className="grid gap-4 sm:grid-cols-2">
        <div>
          <h2 className="font-semibold">Shop</h2>
          <p>{record.shop.name}</p>
          {record.shop.contact.map((c) => (
            <p key={c} className="text-muted">
              {c}
            </p>
          ))}
        </div>
        <div>
          <h2 className="font-semibold">Engine</h2>
          {record.engine.map((l) => (
            <p key={l.label}>
              <span className="text-muted">{l.label}:</span> {l.value}
            </p>
          ))}
        </div>
      </section>
      <section>
        <h2 className="mb-2 text-xl font-semibold">What was measured</h2>
        <p className="mb-3">
          {record.tally.measured} stations measured and {record.derived.length} values computed from them, in{" "}
          {record.sections.map((s) => s.label.toLowerCase()).join(", ") || "no sections"}.
        </p>
        <Tally record={record} />
      </section>
      {decided.length > 0 && (
        <section>
          <h2 className="mb-2 text-xl font-semibold">Decisions on values outside the limits</h2>
          <ul className="flex flex-col gap-2">
            {decided.map((f) => (
              <li key={f.id} className="rounded-tool border-2 border-rule bg-panel p-3">
                <p className="flex flex-wrap items-center gap-2 font-semibold">
                  <VerdictBadge verdict={f.verdict} size="sm" /> {f.what}, {f.station}: {f.value} (limits {f.limits})
                </p>
                {f.decisions.map((d, i) => (
                  <p key={i} className="text-sm">
                    {d.when}
                    {d.who ? `, ${d.who}` : ""}: {d.words}
                  </p>
                ))}
              </li>
            ))}
          </ul>
        </section>
      )}
      {record.torque.length > 0 && (
        <section>
          <h2 className="mb-2 text-xl font-semibold">Fastener torque</h2>
          <ul className="mb-3 flex flex-col gap-1">
            {record.torque.map((t) => (
              <li key={t.station}>
                {t.station}: <strong>{t.value}</strong>, lubricant {t.lubricant.toLowerCase()}
              </li>
            ))}
          </ul>
          <FastenerCaution />
        </section>
      )}
      {record.commonPractice.length > 0 && (
        <Notice tone="caution" title="Limits at typical figures">
          {COMMON_PRACTICE_WORDS}: {record.commonPractice.join("; ")}.
        </Notice>
      )}
      <Notice tone="caution" title="Safety">
        {record.safety.map((line) => (
          <p key={line} className="mb-1">
            {line}
          </p>
        ))}
      </Notice>
    </div>
  );
}
