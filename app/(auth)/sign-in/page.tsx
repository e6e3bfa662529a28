import { redirect } from "next/navigation";
import { Wordmark } from "@/components/ui/logo";
import { currentPageActor, ROLE_HOME } from "@/lib/server/core/access";
import { SignInForm } from "./_components/sign-in-form";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const actor = await currentPageActor();
  if (actor) redirect(ROLE_HOME[actor.role]);
  const { next } = await searchParams;
  const safeNext = next && next.startsWith("/") && !next.startsWith("//") ? next : undefined;
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-8 px-6 py-10">
      <div className="flex flex-col gap-3">
        <Wordmark className="text-ink" />
        <p className="text-muted">Bench measurements, limits and release records for engine builds.</p>
      </div>
      <SignInForm next={safeNext} />
    </main>
  );
}
