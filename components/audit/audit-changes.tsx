import type { AuditChange } from "@/lib/schemas/audit";

// Before → after of one event, a line per changed field: struck-through old value, then new.
export function AuditChanges({ changes, truncated }: { changes: AuditChange[]; truncated: boolean }) {
  if (!changes.length) return <span className="text-muted">No field values recorded</span>;
  return (
    <ul className="flex flex-col gap-0.5">
      {changes.map((c) => (
        <li key={c.path} className="wrap-anywhere" data-kind={c.kind}>
          <span className="text-sm text-muted" title={c.path}>
            {c.label}:
          </span>{" "}
          {c.kind === "added" && (
            <span>
              <span className="sr-only">set to </span>
              <span className="font-medium">{c.after}</span>
            </span>
          )}
          {c.kind === "removed" && (
            <span>
              <span className="sr-only">removed, was </span>
              <del className="text-muted">{c.before}</del>
            </span>
          )}
          {c.kind === "changed" && (
            <span>
              <del className="text-muted">{c.before}</del> <span aria-label="changed to">→</span>{" "}
              <ins className="font-medium no-underline">{c.after}</ins>
            </span>
          )}
        </li>
      ))}
      {truncated && <li className="text-muted">… more fields changed than are shown</li>}
    </ul>
  );
}
