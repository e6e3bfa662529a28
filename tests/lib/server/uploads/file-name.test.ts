import { describe, expect, it } from "vitest";
import { cleanFileName } from "@/lib/server/uploads/content";

// An uploaded file's name is stored (attachments.original_name) and echoed in Content-Disposition:
// in the stored text form, without paths or control characters, never cut inside a character.
describe("an upload's file name", () => {
  it("drops the path, control characters and quotes", () => {
    expect(cleanFileName("C:\\photos\\bore\u0000 1\u0085.jpg", "x")).toBe("bore 1.jpg");
    expect(cleanFileName('a"b.png', "x")).toBe("ab.png");
    expect(cleanFileName("\u0001\u0002", "fallback")).toBe("fallback");
  });

  it("composes letters (Unicode Standard Annex #15, NFC) and mends half characters", () => {
    expect(cleanFileName("cafe\u0301.jpg", "x")).toBe("caf\u00e9.jpg");
    expect(cleanFileName("a\ud800.jpg", "x")).toBe("a\ufffd.jpg");
  });

  it("keeps 200 characters, a character outside the basic plane whole", () => {
    const name = cleanFileName("\u{1F527}".repeat(300), "x");
    expect([...name]).toHaveLength(200);
    expect(name.isWellFormed()).toBe(true);
  });
});
