import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { SignInForm } from "./sign-in-form";
import { WaitingOnTablet } from "./waiting-on-tablet";

// The sign-in screen, drawn by the sign-in page and, offline or after a sign-out, by the bench
// itself (its cached shell never shows the bench to whoever picks the tablet up next).
// `startShop`: public sign-up is on (the sign-in page asks the server; the bench never shows it).
export function SignInScreen({ next, startShop = false }: { next?: string; startShop?: boolean }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-8 px-6 py-10" data-testid="sign-in">
      <div className="flex flex-col gap-3">
        <Wordmark className="text-ink" />
        <p className="text-muted">Bench measurements, limits and release records for engine builds.</p>
      </div>
      <WaitingOnTablet />
      <SignInForm next={next} />
      {startShop && (
        <Link className="inline-flex min-h-11 items-center font-medium text-steel underline" href="/start">
          New to Tenthwise? Start a shop
        </Link>
      )}
    </main>
  );
}
