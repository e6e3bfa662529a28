import { describe, expect, it } from "vitest";
import { fieldWords, pathWords } from "@/lib/server/log/field-words";
import { diffJson } from "@/lib/server/log/query-diff";

// Rule of this product: the audit trail names fields in words, never as code keys.
describe("audit field words", () => {
  it("names known fields from the one table", () => {
    expect(fieldWords("finishedBore")).toBe("Finished bore");
    expect(fieldWords("dueDate")).toBe("Due date");
    expect(fieldWords("limitMin")).toBe("Lower limit");
    expect(fieldWords("typedSignature")).toBe("Signature as typed");
  });

  it("turns a key the table lacks into words, and list indexes into counts from 1", () => {
    expect(fieldWords("rodLength")).toBe("Rod length");
    expect(fieldWords("gasket_bore")).toBe("Gasket bore");
    expect(pathWords("limits.2.max")).toBe("Limits › #3 › Maximum");
  });

  it("labels every change of a before/after diff; no label is a camelCase key", () => {
    const { changes } = diffJson(
      { title: "Old", dueDate: null, engine: { nominalBore: 4.03 } },
      { title: "New", dueDate: "2027-01-04", engine: { nominalBore: 4.04, pistonToWall: 0.0025 } },
    );
    expect(changes.map((c) => c.label)).toEqual([
      "Title",
      "Due date",
      "Engine › Nominal bore",
      "Engine › Piston to wall",
    ]);
    for (const c of changes) expect(c.label).not.toMatch(/[a-z][A-Z]/);
  });
});
