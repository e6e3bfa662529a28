"use client";
import { useRouter } from "next/navigation";
import { startTransition } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { DB_UNAVAILABLE_DIGEST } from "@/lib/schemas/errors";

// A page that could not be drawn. While the database is out of reach (a restart, a failover) the
// words say so and that nothing typed on a tablet is lost; anything else is said plainly too.
export default function PageError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const router = useRouter();
  const outage = error.digest === DB_UNAVAILABLE_DIGEST;
  // A server page drawn again needs a refresh; reset alone would redraw the same error.
  const retry = () =>
    startTransition(() => {
      router.refresh();
      reset();
    });
  return (
    <main className="mx-auto max-w-xl p-6">
      <Notice
        tone={outage ? "info" : "error"}
        title={outage ? "The server cannot reach its database" : "This page could not be shown"}
      >
        {outage ? (
          <p>
            Try again in a moment. Readings taken on a tablet stay on the tablet and are sent once the database is back.
          </p>
        ) : (
          <p>Something went wrong on the server. Try again; if it keeps happening, tell whoever runs Tenthwise.</p>
        )}
      </Notice>
      <div className="mt-4">
        <Button onClick={retry}>Try again</Button>
      </div>
    </main>
  );
}
