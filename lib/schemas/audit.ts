// The audit trail's query contract, shared by the /audit page and GET /api/audit.
//
// GET /api/audit?job=&user=&action=&entity=&entityId=&from=&to=&page=&pageSize=   (lead, inspector)
//   → AuditPage, newest first. `from`/`to` are UTC calendar days, both inclusive. Empty parameters
//   are ignored. `job` matches events on the job itself and on its readings, flags, releases,
//   attachments, limits, and any event whose before/after names the job (jobId).
// GET /api/audit/facets   (lead, inspector) → AuditFacets: the values the filters can take.
import { z } from "zod";
import { storedText } from "./stored-text";

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const id = (what: string) =>
  z.preprocess(
    blank,
    z.coerce
      .number(`${what} must be a number`)
      .int(`${what} must be a whole number`)
      .positive(`${what} must be a whole number`)
      .optional(),
  );
const day = (what: string) => z.preprocess(blank, z.iso.date(`${what} must be a date like 2026-12-01`).optional());
const word = (max: number, what: string) =>
  z.preprocess(blank, storedText(what).trim().max(max, `${what} is at most ${max} characters`).optional());

export const auditQuerySchema = z
  .object({
    job: id("Job"),
    user: id("User"),
    action: word(64, "Action"),
    entity: word(32, "Entity"),
    entityId: word(64, "Entity id"),
    from: day("From"),
    to: day("To"),
    page: z.preprocess(blank, z.coerce.number("Page must be a number").int().min(1, "Pages start at 1").default(1)),
    pageSize: z.preprocess(
      blank,
      z.coerce.number("Page size must be a number").int().min(1).max(100, "At most 100 events a page").default(25),
    ),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, {
    path: ["to"],
    message: "The end date is before the start date; swap them",
  });

export type AuditQuery = z.output<typeof auditQuerySchema>;
export type AuditQueryInput = z.input<typeof auditQuerySchema>;

export type AuditChange = {
  path: string;
  /** The path in words ("Limits › #3 › Maximum"), what the audit screen shows. */
  label: string;
  kind: "added" | "removed" | "changed";
  before: string | null;
  after: string | null;
};

export type AuditEventView = {
  id: number;
  at: string;
  userId: number | null;
  userName: string | null;
  action: string;
  entityType: string;
  entityId: string;
  jobId: number | null;
  jobCode: string | null;
  changes: AuditChange[];
  /** True when the list of changes was cut short (very large before/after). */
  truncated: boolean;
};

export type AuditPage = {
  events: AuditEventView[];
  page: number;
  pageSize: number;
  /** How many events match; with `more`, at least this many (counting stops a few thousand past the page). */
  total: number;
  more: boolean;
  /** Pages of `total`; with `more`, at least this many. */
  pages: number;
};

export type AuditFacets = {
  actions: string[];
  entities: string[];
  users: { id: number; name: string }[];
  jobs: { id: number; code: string; title: string }[];
};
