"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { api, ApiError } from "@/lib/client/api";
import { ResendLink } from "./resend-link";

// Where the e-mailed link lands. Opening the shop is a button, not the page load, so a mail
// scanner that fetches links cannot use the link up before its owner does.
export function ConfirmShop({ token }: { token: string }) {
  const [state, setState] = useState<{ busy?: boolean; error?: string }>({});
  const confirm = async () => {
    setState({ busy: true });
    try {
      const res = await api<{ home: string }>("/api/shops/verify", { method: "POST", json: { token } });
      window.location.assign(res.home);
    } catch (err) {
      setState({ error: err instanceof ApiError ? err.message : "Could not reach the server. Try again in a moment." });
    }
  };
  return (
    <section className="flex flex-col gap-4 rounded-tool border-2 border-rule bg-panel p-6">
      <h1 className="text-2xl font-semibold">Open your shop</h1>
      <p>Confirm this e-mail address to open the shop. You are signed in as its admin straight away.</p>
      {state.error ? (
        <>
          <Notice tone="error">{state.error}</Notice>
          <ResendLink />
          <Link className="inline-flex min-h-11 items-center font-medium text-steel underline" href="/sign-in">
            Go to sign-in
          </Link>
        </>
      ) : (
        <Button type="button" big onClick={confirm} disabled={state.busy}>
          {state.busy ? "Opening…" : "Confirm and open the shop"}
        </Button>
      )}
    </section>
  );
}
