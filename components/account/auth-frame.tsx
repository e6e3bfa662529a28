import type { ReactNode } from "react";
import { Wordmark } from "@/components/ui/logo";

// The frame of the signed-out account pages (choose a password, forgot, reset): the same narrow,
// tablet-sized column as the sign-in screen.
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-8 px-6 py-10">
      <Wordmark className="text-ink" />
      <section className="flex flex-col gap-5 rounded-tool border-2 border-rule bg-panel p-6">
        <h1 className="text-2xl font-semibold">{title}</h1>
        {children}
      </section>
    </main>
  );
}

/** A link as large as a button, for the few links these pages have. */
export const bigLink = [
  "inline-flex min-h-11 items-center self-start rounded-tool px-1",
  "font-semibold text-steel underline underline-offset-4",
].join(" ");

/** The one big way on from a finished step, as large as the big button. */
export const bigButtonLink = [
  "inline-flex min-h-16 items-center justify-center rounded-tool bg-steel px-6",
  "text-lg font-semibold text-steel-ink",
].join(" ");
