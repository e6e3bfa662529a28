import { dictionary } from "@zxcvbn-ts/language-common";
import { describe, expect, it } from "vitest";
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH, passwordLengthProblem } from "@/lib/schemas/password";
import { BCRYPT_COST } from "@/lib/server/passwords/hash";
import { passwordProblem } from "@/lib/server/passwords/policy";

describe("password policy", () => {
  it("asks for at least 12 characters, above the floor of 8 in NIST SP 800-63B (rev. 3), 5.1.1.2", () => {
    expect(PASSWORD_MIN_LENGTH).toBeGreaterThanOrEqual(8); // NIST SP 800-63B, 5.1.1.2
    expect(passwordLengthProblem("a".repeat(11))).toMatch(/at least 12 characters \(11 so far\)/);
    expect(passwordLengthProblem("a".repeat(12))).toBeNull();
  });

  it("counts characters, not UTF-16 units, and refuses what bcrypt would cut at 72 bytes", () => {
    // "é" is 2 bytes in UTF-8 (RFC 3629); twelve of them are 12 characters and 24 bytes.
    expect(passwordLengthProblem("é".repeat(12))).toBeNull();
    expect(passwordLengthProblem("é".repeat(37))).toMatch(/at most 72 bytes/); // 74 bytes
    expect(passwordLengthProblem("a".repeat(PASSWORD_MAX_BYTES))).toBeNull();
  });

  it("refuses every long-enough entry of the common list shipped with @zxcvbn-ts/language-common, in any case", () => {
    const listed = (dictionary["passwords-common"] as string[]).filter((p) => p.length >= PASSWORD_MIN_LENGTH);
    expect(listed.length).toBeGreaterThan(100);
    for (const p of listed) expect(passwordProblem(p)).toMatch(/common passwords/);
    expect(passwordProblem("QWERTY123456")).toMatch(/common passwords/);
    expect(passwordProblem("dial bore gauge at three heights")).toBeNull();
  });

  it("refuses the person's own e-mail address or name", () => {
    const person = { email: "harriet.vance@shop.example", name: "Harriet Vance" };
    expect(passwordProblem("harriet.vance@shop.example", person)).toMatch(/own name or e-mail/);
    expect(passwordProblem("HarrietVance", { ...person, name: "Harriet  Vance" })).toMatch(/own name or e-mail/);
    expect(passwordProblem("harriet vance rebuilds heads", person)).toBeNull();
  });

  it("states one bcrypt cost, at least the 10 commonly recommended (common practice)", () => {
    expect(BCRYPT_COST).toBeGreaterThanOrEqual(10);
  });
});
