// Next calls register() once when a server process starts. The mail notifier runs only in the
// Node.js runtime (NEXT_RUNTIME is set by Next itself, so the edge build drops this branch) and
// never while `next build` runs; startNotifier keeps it to one timer per process.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { isBuildPhase } = await import("@/lib/server/core/env");
  if (isBuildPhase()) return;
  // Each request's socket address, for the client address behind TRUSTED_PROXIES.
  const { installPeerStamp } = await import("@/lib/server/core/peer-address");
  installPeerStamp();
  const { startNotifier } = await import("@/lib/server/notify/notifier");
  try {
    if (startNotifier()) console.log("[tenthwise] mail notifier started");
  } catch (err) {
    // A configuration error is reported, but the app still serves pages.
    console.error("[tenthwise] mail notifier not started:", err instanceof Error ? err.message : err);
  }
}
