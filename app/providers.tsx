"use client";

import { QueryClientProvider } from "@tanstack/react-query";
import { SerwistProvider } from "@serwist/next/react";
import type { ReactNode } from "react";
import { getQueryClient } from "@/lib/client/query-client";

// The service worker is registered on every page, so the first visit (even the sign-in page)
// already precaches the bench. It never reloads a page by itself: no reload when the network
// comes back (an entry may be half typed), and updates wait for the machinist (update-banner).
// A classic (not module) worker, so older tablet browsers can run it too.
export function Providers({ children }: { children: ReactNode }) {
  return (
    <SerwistProvider
      swUrl="/sw.js"
      options={{ scope: "/", type: "classic" }}
      disable={process.env.NODE_ENV === "development"}
      reloadOnOnline={false}
      cacheOnNavigation={false}
    >
      <QueryClientProvider client={getQueryClient()}>{children}</QueryClientProvider>
    </SerwistProvider>
  );
}
