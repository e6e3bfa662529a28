import { redirect } from "next/navigation";
import { SignInScreen } from "@/components/sign-in-screen";
import { currentPageActor, ROLE_HOME } from "@/lib/server/core/access";
import { publicSignUpOpen } from "@/lib/server/shops/signup";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const actor = await currentPageActor();
  if (actor) redirect(ROLE_HOME[actor.role]);
  const { next } = await searchParams;
  const safeNext = next && next.startsWith("/") && !next.startsWith("//") ? next : undefined;
  return <SignInScreen next={safeNext} startShop={publicSignUpOpen()} />;
}
