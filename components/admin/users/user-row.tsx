"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { StatusTag } from "@/components/admin/status-tag";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/client/api";
import { ROLE_WORDS } from "@/lib/nav";
import type { AdminUser, UpdateUserInput } from "@/lib/schemas/user";
import { ROLES, type Role } from "@/lib/schemas/enums";
import type { Invited, Issued } from "./invite-form";

const when = (iso: string | null) =>
  iso ? new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" }) : "never";

export function UserRow({
  user,
  isSelf,
  onIssued,
  onInvited,
}: {
  user: AdminUser;
  isSelf: boolean;
  onIssued: (i: Issued) => void;
  onInvited: (i: Invited) => void;
}) {
  const qc = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const [confirm, setConfirm] = useState<"deactivate" | "reset" | null>(null);
  const done = (u: AdminUser) => {
    qc.setQueryData<{ users: AdminUser[] }>(["admin-users"], (old) =>
      old ? { users: old.users.map((x) => (x.id === u.id ? u : x)) } : old,
    );
    void qc.invalidateQueries({ queryKey: ["admin-users"] });
    setConfirm(null);
    setError(null);
  };
  const fail = (err: unknown) =>
    setError(err instanceof ApiError ? err.message : "Could not reach the server; try again.");
  const update = useMutation({
    mutationFn: (change: UpdateUserInput) =>
      api<{ user: AdminUser }>(`/api/users/${user.id}`, { method: "PATCH", json: change }),
    onSuccess: (r) => done(r.user),
    onError: fail,
  });
  const reset = useMutation({
    mutationFn: () => api<Issued>(`/api/users/${user.id}/password`, { method: "POST" }),
    onSuccess: (r) => {
      done(r.user);
      onIssued(r);
    },
    onError: fail,
  });
  const resend = useMutation({
    mutationFn: () => api<Invited>(`/api/users/${user.id}/invitation`, { method: "POST" }),
    onSuccess: (r) => {
      done(r.user);
      onInvited(r);
    },
    onError: fail,
  });
  const busy = update.isPending || reset.isPending || resend.isPending;
  return (
    <tr className="border-t-2 border-rule align-top" data-testid={`user-${user.email}`}>
      <td className="p-3">
        <div className="font-semibold">
          {user.name}
          {isSelf && <span className="ml-2 text-sm font-normal text-muted">(you)</span>}
        </div>
        <div className="text-sm text-muted">{user.email}</div>
      </td>
      <td className="p-3">
        <select
          aria-label={`Role of ${user.name}`}
          value={user.role}
          disabled={isSelf || busy || !user.active}
          title={isSelf ? "Nobody changes their own role; another admin has to" : undefined}
          onChange={(e) => update.mutate({ role: e.target.value as Role })}
          className="min-h-11 rounded-tool border-2 border-rule bg-paper px-2 disabled:opacity-60"
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_WORDS[r]}
            </option>
          ))}
        </select>
        <p className="mt-1 text-xs text-muted">
          {isSelf ? "Another admin changes your role." : "A new role signs them out on every device."}
        </p>
      </td>
      <td className="p-3">
        {user.active ? <StatusTag tone="good">Active</StatusTag> : <StatusTag tone="off">Deactivated</StatusTag>}
      </td>
      <td className="p-3 text-sm tabular">{when(user.lastSignInAt)}</td>
      <td className="p-3">
        <div className="flex flex-wrap gap-2">
          {confirm === null && user.active && !isSelf && (
            <Button tone="quiet" disabled={busy} onClick={() => setConfirm("deactivate")}>
              Deactivate
            </Button>
          )}
          {confirm === null && !user.active && (
            <Button tone="quiet" disabled={busy} onClick={() => update.mutate({ active: true })}>
              Reactivate
            </Button>
          )}
          {confirm === null && user.active && !isSelf && !user.lastSignInAt && (
            <Button tone="quiet" disabled={busy} onClick={() => resend.mutate()}>
              Send invitation again
            </Button>
          )}
          {confirm === null && user.active && (
            <Button tone="quiet" disabled={busy} onClick={() => setConfirm("reset")}>
              Reset password
            </Button>
          )}
          {confirm === "deactivate" && (
            <>
              <Button tone="danger" disabled={busy} onClick={() => update.mutate({ active: false })}>
                Yes, deactivate {user.name}
              </Button>
              <Button tone="quiet" onClick={() => setConfirm(null)}>
                Cancel
              </Button>
            </>
          )}
          {confirm === "reset" && (
            <>
              <Button tone="accent" disabled={busy} onClick={() => reset.mutate()}>
                Yes, issue a new password
              </Button>
              <Button tone="quiet" onClick={() => setConfirm(null)}>
                Cancel
              </Button>
            </>
          )}
        </div>
        {confirm === "deactivate" && (
          <p className="mt-1 text-sm text-muted">
            They are signed out on every device and can no longer sign in; their records stay.
          </p>
        )}
        {confirm === "reset" && (
          <p className="mt-1 text-sm text-muted">
            {isSelf
              ? "Your current password stops working at once, and your other devices are signed out."
              : "Their current password stops working at once, and they are signed out on every device. " +
                "The new one works for one sign-in; then they choose their own."}
          </p>
        )}
        {error && (
          <p role="alert" className="mt-2 text-sm font-medium text-fail">
            {error}
          </p>
        )}
      </td>
    </tr>
  );
}
