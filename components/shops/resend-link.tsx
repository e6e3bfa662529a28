"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";

// "Send the link again": for a confirmation link that ran out or never arrived. The answer is the
// same whether or not the address has a shop waiting.
export function ResendLink({ email: given }: { email?: string }) {
  const [email, setEmail] = useState(given ?? "");
  const [state, setState] = useState<{ sent?: string; error?: string; busy?: boolean }>({});
  const send = async () => {
    setState({ busy: true });
    try {
      await api("/api/shops/resend", { method: "POST", json: { email } });
      setState({ sent: email });
    } catch (err) {
      setState({ error: err instanceof ApiError ? err.message : "Could not reach the server. Try again in a moment." });
    }
  };
  return (
    <div className="flex flex-col gap-3">
      {!given && (
        <TextField label="Your e-mail" type="email" value={email} onChange={(ev) => setEmail(ev.target.value)} />
      )}
      {state.error && <Notice tone="error">{state.error}</Notice>}
      {state.sent && (
        <Notice>
          If a shop is waiting for {state.sent} to be confirmed, a new link is on its way. Earlier links no longer work.
        </Notice>
      )}
      <Button type="button" onClick={send} disabled={state.busy || !email}>
        {state.busy ? "Sending…" : "Send the link again"}
      </Button>
    </div>
  );
}
