import { describe, expect, it } from "vitest";
import { shopSlug } from "@/lib/server/shops/create-shop";

describe("shopSlug", () => {
  it("writes a name the same way for the unique slug, so names differing only in case or marks collide", () => {
    expect(shopSlug("Vega & Sons Machine")).toBe("vega-sons-machine");
    expect(shopSlug("VEGA & SONS  machine!")).toBe("vega-sons-machine");
    expect(shopSlug("Mécanique Gérard")).toBe("mecanique-gerard");
  });

  it("keeps slugs short and gives a name without Latin letters its own stable slug", () => {
    expect(shopSlug("a".repeat(60) + " b").length).toBeLessThanOrEqual(48);
    expect(shopSlug("東京エンジン")).toMatch(/^shop-[0-9a-f]{12}$/);
    expect(shopSlug("東京エンジン")).toBe(shopSlug("東京エンジン"));
    expect(shopSlug("東京エンジン")).not.toBe(shopSlug("大阪エンジン"));
  });
});
