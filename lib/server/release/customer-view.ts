import "server-only";
import { checkCustomerToken } from "@/lib/server/release/customer-link";
import { findReleaseOwner } from "@/lib/server/release/repo";
import { loadBuildRecord } from "@/lib/server/record/data";
import type { BuildRecord } from "@/lib/schemas/record";
import { findShopContact } from "@/lib/server/users/repo";
import type { ShopContact } from "@/lib/schemas/user";

// What a customer's link opens: the record of the one release it names, or why it cannot.
export type CustomerView =
  | { status: "ok"; record: BuildRecord; expiresAt: Date; releaseId: number; shopId: number; jobId: number }
  | { status: "expired"; shop: ShopContact | null; expiredAt: Date }
  | { status: "invalid" };

export async function customerView(token: string): Promise<CustomerView> {
  const check = checkCustomerToken(token);
  if (!check.ok && check.reason === "invalid") return { status: "invalid" };
  const release = await findReleaseOwner(check.releaseId);
  if (!release) return { status: "invalid" };
  if (!check.ok) return { status: "expired", shop: await findShopContact(release.shopId), expiredAt: check.expiresAt };
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
