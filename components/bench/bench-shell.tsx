"use client";

import { lazy, Suspense, useEffect, useState, type ReactNode } from "react";
import { HeaderBar } from "@/components/header-bar";
import { Notice } from "@/components/ui/notice";
import { BENCH_ROLES } from "@/lib/schemas/enums";
import { getBenchDb } from "@/lib/offline/db";
import { ensureDeviceId, getMeta, type DeviceActor } from "@/lib/offline/meta";
import { endedSessions, rememberActor, reportEndedSessions } from "@/lib/offline/sign-out";
import { lazyEngine } from "@/lib/offline/engine-handle";
import { BenchProvider, type Bench } from "./bench-context";
import { whenSettled } from "@/hooks/use-after-paint";
import { BenchBar } from "./bench-bar";

// The bench is a client shell (precached by the service worker), so it opens with no network.
// Who is measuring comes from /api/me when the server answers, else from the last answer kept
// on the tablet: offline, the machinist is never bounced to the sign-in page. After a sign-out
// nobody is kept, so the shell draws the sign-in screen instead (lib/offline/sign-out.ts); a
// session signed out here is never taken up again, even if the server has not heard yet. Data is
// still only ever served by signed-in API routes.
// Its form code loads only when the tablet is locked, never on the bench's first load.
const SignInScreen = lazy(() => import("@/components/sign-in-screen").then((m) => ({ default: m.SignInScreen })));

type Boot =
  { kind: "loading" } | { kind: "ready"; bench: Bench } | { kind: "locked" } | { kind: "failed"; message: string };

async function whoIsSignedIn(): Promise<DeviceActor | "signed-out" | "offline" | "must-change"> {
  const ctl = new AbortController();
  const timer = setTimeout(() => ctl.abort(), 6000);
  try {
    const res = await fetch("/api/me", { cache: "no-store", credentials: "same-origin", signal: ctl.signal });
    if (res.status === 401) return "signed-out";
    if (!res.ok) return "offline";
    const me = (await res.json()) as {
      user: { id: number; name: string; email: string; role: DeviceActor["role"] };
      shop: { id: number } | null;
      sessionId: string | null;
      mustChangePassword?: boolean;
    };
    if (me.mustChangePassword) return "must-change";
    return {
      userId: me.user.id,
      shopId: me.shop?.id ?? 0,
      name: me.user.name,
      email: me.user.email,
      role: me.user.role,
      ...(me.sessionId ? { sessionId: me.sessionId } : {}),
    };
  } catch {
    return "offline";
  } finally {
    clearTimeout(timer);
  }
}

/** Where to come back to after signing in: this bench page (offline, any other page opens as the bench shell). */
const benchPath = () =>
  window.location.pathname.startsWith("/bench") ? window.location.pathname + window.location.search : undefined;

let engine: ReturnType<typeof lazyEngine> | undefined;

async function boot(): Promise<Boot> {
  const db = getBenchDb();
  const deviceId = await ensureDeviceId(db);
  await reportEndedSessions(db);
  const answer = await whoIsSignedIn();
  // Signed out here while the server could not hear it: that session is never taken up again.
  if (typeof answer === "object" && (await endedSessions(db)).includes(answer.sessionId ?? ""))
    return { kind: "locked" };
  if (answer === "must-change") {
    // A temporary password from an admin: the account screen first (the server refuses the rest).
    window.location.assign("/account");
    return { kind: "loading" };
  }
  if (answer === "signed-out") {
    // The server ended the session (signed out elsewhere, password reset, role change): forget it here too.
    await db.meta.delete("actor");
    window.location.assign(`/sign-in?next=${encodeURIComponent(window.location.pathname + window.location.search)}`);
    return { kind: "loading" };
  }
  const actor = answer === "offline" ? await getMeta<DeviceActor>(db, "actor") : answer;
  if (!actor) return { kind: "locked" };
  if (answer !== "offline") await rememberActor(db, actor);
  if (!(BENCH_ROLES as readonly string[]).includes(actor.role)) {
    window.location.assign("/");
    return { kind: "loading" };
  }
  engine ??= lazyEngine(db, () => import("@/lib/offline/sync-engine"));
  return { kind: "ready", bench: { db, engine, actor, deviceId } };
}

export function BenchShell({ children }: { children: ReactNode }) {
  const [state, setState] = useState<Boot>({ kind: "loading" });
  useEffect(() => {
    boot().then(setState, (err: unknown) =>
      setState({ kind: "failed", message: err instanceof Error ? err.message : String(err) }),
    );
  }, []);
  // Opened while the worker was still installing (first visit): ask it to take this page over.
  useEffect(() => {
    // `ready` never settles without a worker (private mode, an old browser): the bench still works online.
    void navigator.serviceWorker?.ready.then((reg) => {
      if (!navigator.serviceWorker.controller) reg.active?.postMessage({ type: "TW_CLAIM" });
    });
  }, []);
  // The sync engine's code loads once the bench is on screen and settled; it syncs as soon as it
  // starts (an entry made before then is sent in that first run).
  useEffect(() => (state.kind === "ready" ? whenSettled(() => void engine?.start()) : undefined), [state.kind]);

  if (state.kind === "ready") {
    return (
      <BenchProvider value={state.bench}>
        <HeaderBar actor={state.bench.actor} current="/bench" link="a" />
        <BenchBar />
        {children}
      </BenchProvider>
    );
  }
  if (state.kind === "locked")
    return (
      <Suspense fallback={null}>
        <SignInScreen next={benchPath()} />
      </Suspense>
    );
  return (
    <main className="mx-auto flex max-w-3xl flex-col gap-4 px-4 py-10" aria-busy={state.kind === "loading"}>
      {state.kind === "loading" && <p className="text-lg text-muted">Opening the bench…</p>}
      {state.kind === "failed" && (
        <Notice tone="error" title="The bench could not open its storage">
          {state.message}. Check that this browser allows site data (private mode blocks it), then reload.
        </Notice>
      )}
    </main>
  );
}
