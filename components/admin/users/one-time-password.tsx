"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";

// Shown once, right after an invite or a reset; the server never sends it again.
export function OneTimePassword({
  name,
  email,
  password,
  onDone,
}: {
  name: string;
  email: string;
  password: string;
  onDone: () => void;
}) {
  const [copied, setCopied] = useState(false);
  async function copy() {
    try {
      await navigator.clipboard.writeText(password);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  }
  return (
    <section
      role="status"
      aria-label="Temporary password"
      className="flex flex-col gap-3 rounded-tool border-2 border-l-8 border-brass bg-panel p-4"
    >
      <h2 className="text-lg font-semibold">Temporary password for {name}</h2>
      <p className="text-sm text-muted">
        Sign-in e-mail <span className="font-medium text-ink">{email}</span>. Shown once: hand it to {name} in person or
        read it out, and ask them to sign in now. It works for that one sign-in; Tenthwise then asks them to choose
        their own. It is not kept readable and cannot be shown again; if it is lost, reset it.
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <code
          data-testid="temporary-password"
          className="rounded-tool border-2 border-rule bg-paper px-4 py-2 font-mono text-2xl tracking-wider"
        >
          {password}
        </code>
        <Button tone="quiet" onClick={copy}>
          {copied ? "Copied" : "Copy"}
        </Button>
        <Button onClick={onDone}>Done, I have passed it on</Button>
      </div>
    </section>
  );
}
