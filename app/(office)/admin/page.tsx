import { requirePageActor } from "@/lib/server/core/access";
import { ROLE_WORDS } from "@/lib/nav";
import { findShop, listUsers } from "@/lib/server/users/repo";
import { ShopArchive } from "@/components/admin/shop-archive";

export const metadata = { title: "Shop" };

export default async function AdminHome() {
  const actor = await requirePageActor(["admin"]);
  const [shop, users] = await Promise.all([findShop(actor.shopId), listUsers(actor.shopId)]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">{shop?.name}</h1>
      <p className="text-muted">Default units: {shop?.unitSystem === "mm" ? "metric (mm)" : "inch"}</p>
      <section className="rounded-tool border-2 border-rule bg-panel p-4">
        <h2 className="mb-3 text-xl font-semibold">People</h2>
        <ul className="divide-y divide-rule">
          {users.map((u) => (
            <li key={u.id} className="flex justify-between py-2">
              <span>
                {u.name} <span className="text-muted">· {u.email}</span>
              </span>
              <span>
                {ROLE_WORDS[u.role]}
                {u.active ? "" : " (inactive)"}
              </span>
            </li>
          ))}
        </ul>
      </section>
      <ShopArchive />
    </main>
  );
}
