import "server-only";
import { Release, Shop } from "@/models";
import { checkCustomerToken } from "@/lib/server/release/customer-link";
import { getSequelize } from "@/lib/server/core/db";
import { loadBuildRecord } from "@/lib/server/record/data";
import type { BuildRecord } from "@/lib/server/record/types";

// What a customer's link opens: the record of the one release it names, or why it cannot.
export type ShopContact = { name: string; email: string | null; phone: string | null };
export type CustomerView =
  | { status: "ok"; record: BuildRecord; expiresAt: Date; releaseId: number; shopId: number; jobId: number }
  | { status: "expired"; shop: ShopContact | null; expiredAt: Date }
  | { status: "invalid" };

async function releaseOf(id: number) {
  getSequelize();
  const r = await Release.findByPk(id);
  return r ? { id: r.id, shopId: r.shopId, jobId: r.jobId } : null;
}

async function contactOf(shopId: number): Promise<ShopContact | null> {
  const shop = await Shop.findByPk(shopId);
  return shop ? { name: shop.name, email: shop.email ?? null, phone: shop.phone ?? null } : null;
}

export async function customerView(token: string): Promise<CustomerView> {
  const check = checkCustomerToken(token);
  if (!check.ok && check.reason === "invalid") return { status: "invalid" };
  const release = await releaseOf(check.releaseId);
  if (!release) return { status: "invalid" };
  if (!check.ok) return { status: "expired", shop: await contactOf(release.shopId), expiredAt: check.expiresAt };
  const record = await loadBuildRecord(release.shopId, release.jobId, { releaseId: release.id });
  return {
    status: "ok",
    record,
    expiresAt: check.expiresAt,
    releaseId: release.id,
    shopId: release.shopId,
    jobId: release.jobId,
  };
}
