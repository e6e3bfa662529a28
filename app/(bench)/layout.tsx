import { BenchShell } from "@/components/bench/bench-shell";

// Static on purpose: the bench pages are prerendered shells the service worker precaches, so
// they open with no network. Who is signed in is settled on the client (see BenchShell), and
// every piece of data comes from signed-in API routes.
export default function BenchLayout({ children }: { children: React.ReactNode }) {
  return <BenchShell>{children}</BenchShell>;
}
