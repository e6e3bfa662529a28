import { UserAdmin } from "@/components/admin/users/user-admin";
import { requirePageActor } from "@/lib/server/core/access";

export const metadata = { title: "Users" };

export default async function UsersPage() {
  const actor = await requirePageActor(["admin"]);
  return (
    <main className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6">
      <h1 className="text-3xl font-semibold">Users</h1>
      <UserAdmin selfId={actor.userId} />
    </main>
  );
}
