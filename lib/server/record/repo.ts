import "server-only";
import type { UnitSystem } from "@/lib/schemas/enums";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

// The parties of a build record: the shop, the customer and the engine, as plain objects.
export type RecordParties = {
  shop: { name: string; address: string | null; phone: string | null; email: string | null; unitSystem: UnitSystem };
  customer: { name: string; email: string | null; phone: string | null };
  engine: {
    description: string;
    layout: string;
    cylinders: number;
    mains: number;
    unitSystem: UnitSystem;
    nominalBore: number;
    nominalStroke: number;
    blockMaterial: string;
    headMaterial: string | null;
    pistonMaterial: string | null;
    blockSerial: string | null;
    crankSerial: string | null;
    headSerials: string | null;
    fuel: string | null;
  };
};

export async function loadRecordParties(shopId: number, customerId: number, engineId: number): Promise<RecordParties> {
  const { Customer, Engine, Shop } = models();
  const [shop, customer, engine] = await Promise.all([
    Shop.findByPk(shopId),
    Customer.findOne({ where: { id: customerId, shopId } }),
    Engine.findOne({ where: { id: engineId, shopId } }),
  ]);
  if (!shop || !engine) throw notFound("Job");
  return {
    shop: {
      name: shop.name,
      address: shop.address ?? null,
      phone: shop.phone ?? null,
      email: shop.email ?? null,
      unitSystem: shop.unitSystem,
    },
    customer: { name: customer?.name ?? "", email: customer?.email ?? null, phone: customer?.phone ?? null },
    engine: {
      description: engine.description,
      layout: engine.layout,
      cylinders: engine.cylinders,
      mains: engine.mains,
      unitSystem: engine.unitSystem,
      nominalBore: engine.nominalBore,
      nominalStroke: engine.nominalStroke,
      blockMaterial: engine.blockMaterial,
      headMaterial: engine.headMaterial ?? null,
      pistonMaterial: engine.pistonMaterial ?? null,
      blockSerial: engine.blockSerial ?? null,
      crankSerial: engine.crankSerial ?? null,
      headSerials: engine.headSerials ?? null,
      fuel: engine.fuel ?? null,
    },
  };
}
