import { BenchShell } from "@/components/bench/bench-shell";

// The bench pages are shells the service worker precaches (serwist.config.js), so they open with
// no network: nothing here depends on who asks. Who is signed in is settled on the client (see
// BenchShell), and every piece of data comes from signed-in API routes.
export default function BenchLayout({ children }: { children: React.ReactNode }) {
  return <BenchShell>{children}</BenchShell>;
}
