import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { Notice } from "@/components/ui/notice";
import { StartShopForm } from "@/components/shops/start-shop-form";
import { publicSignUpOpen, SIGN_UP_CLOSED } from "@/lib/server/shops/signup";

export const metadata = { title: "Start a shop" };
export const dynamic = "force-dynamic";

export default function StartShopPage() {
  const open = publicSignUpOpen();
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-8 px-6 py-10">
      <div className="flex flex-col gap-3">
        <Wordmark className="text-ink" />
        <p className="text-muted">
          Your shop starts with three starter spec sheets of typical figures, and a short guide to the first job.
        </p>
      </div>
      {open ? <StartShopForm /> : <Notice title="Sign-up is closed here">{SIGN_UP_CLOSED}</Notice>}
      <Link className="inline-flex min-h-11 items-center font-medium text-steel underline" href="/sign-in">
        Already have an account? Sign in
      </Link>
    </main>
  );
}
