import "server-only";

// A shop archive file's shape: its columns (header, SQL, kind of value), the tables it reads and the
// key its rows are ordered and paged by (files.ts and gauge-files.ts list the files).

export type Kind = "text" | "number" | "time" | "date" | "bool" | "json";
export type Column = { header: string; sql: string; kind: Kind };
export type ArchiveFile = {
  name: string;
  columns: Column[];
  from: string;
  shopColumn: string;
  key: string[];
};

export const col = (header: string, sql: string, kind: Kind = "text"): Column => ({ header, sql, kind });
export const userName = (alias: string) => `(SELECT u.name FROM users u WHERE u.id = ${alias})`;
