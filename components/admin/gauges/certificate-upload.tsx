"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRef, useState } from "react";
import { ApiError } from "@/lib/client/api";
import type { InstrumentRecord } from "@/lib/schemas/instrument";

// Posts the certificate to the uploads route (ownerType 'instrument'), which links it to the
// gauge; the list is then re-read so the new link shows.
async function send(gaugeId: number, file: File): Promise<void> {
  const form = new FormData();
  form.set("file", file);
  form.set("ownerType", "instrument");
  form.set("ownerId", String(gaugeId));
  form.set("clientId", crypto.randomUUID());
  const res = await fetch("/api/attachments", { method: "POST", body: form, credentials: "same-origin" });
  if (!res.ok) {
    const body = await res.json().catch(() => null);
    const e = body?.error;
    const field = e?.fields ? Object.values(e.fields as Record<string, string[]>)[0]?.[0] : undefined;
    throw new ApiError(
      res.status,
      e?.code ?? "http_error",
      field ?? e?.message ?? `The server answered ${res.status}`,
      e?.fields,
    );
  }
}

export function CertificateCell({ gauge, canEdit }: { gauge: InstrumentRecord; canEdit: boolean }) {
  const qc = useQueryClient();
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<string | null>(null);
  const upload = useMutation({
    mutationFn: (file: File) => send(gauge.id, file),
    onSuccess: () => {
      setError(null);
      void qc.invalidateQueries({ queryKey: ["instruments"] });
    },
    onError: (err) => setError(err instanceof ApiError ? err.message : "Could not reach the server; try again."),
  });
  return (
    <div className="flex flex-col items-start gap-1">
      {gauge.certificate ? (
        <a
          href={gauge.certificate.url}
          target="_blank"
          rel="noreferrer"
          className="font-medium text-steel underline underline-offset-2"
        >
          Certificate: {gauge.certificate.name}
        </a>
      ) : (
        <span className="text-sm text-muted">No certificate on file</span>
      )}
      {canEdit && (
        <label
          className={
            "no-print inline-flex min-h-11 cursor-pointer items-center rounded-tool border-2 border-rule bg-panel " +
            "px-3 text-sm font-semibold hover:border-muted"
          }
        >
          {upload.isPending ? "Uploading…" : gauge.certificate ? "Replace certificate" : "Upload certificate"}
          <input
            ref={input}
            type="file"
            accept="application/pdf,image/jpeg,image/png"
            className="sr-only"
            aria-label={`Calibration certificate for ${gauge.label}`}
            disabled={upload.isPending}
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) upload.mutate(file);
              e.target.value = "";
            }}
          />
        </label>
      )}
      {error && (
        <p role="alert" className="text-sm font-medium text-fail">
          {error}
        </p>
      )}
    </div>
  );
}
