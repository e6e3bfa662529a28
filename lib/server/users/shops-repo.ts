import "server-only";
import { Shop } from "@/models";
import { getSequelize } from "@/lib/server/core/db";

export type ShopRecord = { id: number; name: string; unitSystem: "in" | "mm"; guardBandPolicy: string };

export async function findShop(id: number): Promise<ShopRecord | null> {
  getSequelize();
  const s = await Shop.findByPk(id);
  return s
    ? { id: s.id, name: s.name, unitSystem: s.unitSystem as "in" | "mm", guardBandPolicy: s.guardBandPolicy }
    : null;
}
