// Which header entry is current on each office page (the header works it out from the path).
import { describe, expect, it } from "vitest";
import { currentNav } from "@/lib/nav";

describe("currentNav", () => {
  it.each([
    ["lead", "/desk", "/desk"],
    ["lead", "/desk/jobs/12/plan", "/desk"],
    ["lead", "/desk/flags/7", "/desk/flags"],
    ["lead", "/desk/specs/import", "/desk/specs"],
    ["lead", "/admin/gauges", "/admin/gauges"],
    ["lead", "/release/12", "/release"],
    ["admin", "/admin", "/admin"],
    ["admin", "/admin/mail", "/admin/mail"],
    ["admin", "/desk/jobs/12", "/desk"],
    ["inspector", "/release/12", "/release"],
    ["inspector", "/desk/jobs/12/maps", "/release"],
    ["inspector", "/audit", "/audit"],
  ] as const)("%s on %s: %s", (role, path, expected) => {
    expect(currentNav(role, path)).toBe(expected);
  });

  it("matches whole path segments only, and nothing off the role's menu", () => {
    expect(currentNav("admin", "/administrator")).toBeUndefined();
    expect(currentNav("machinist", "/desk")).toBeUndefined();
  });
});
