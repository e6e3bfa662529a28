import { redirect } from "next/navigation";
import { currentPageActor, ROLE_HOME } from "@/lib/server/core/access";

export default async function Home() {
  const actor = await currentPageActor();
  redirect(actor ? ROLE_HOME[actor.role] : "/sign-in");
}
