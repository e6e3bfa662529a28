"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Notice } from "@/components/ui/notice";
import { api } from "@/lib/client/api";
import type { AdminUser } from "@/lib/schemas/user";
import { InviteForm, type Invited, type Issued } from "./invite-form";
import { OneTimePassword } from "./one-time-password";
import { UserRow } from "./user-row";

export function UserAdmin({ selfId }: { selfId: number }) {
  const [issued, setIssued] = useState<Issued | null>(null);
  const [invited, setInvited] = useState<Invited | null>(null);
  const onInvited = (i: Invited) => {
    setIssued(null);
    setInvited(i);
  };
  const users = useQuery({ queryKey: ["admin-users"], queryFn: () => api<{ users: AdminUser[] }>("/api/users") });
  return (
    <div className="flex flex-col gap-6">
      {issued && (
        <OneTimePassword
          name={issued.user.name}
          email={issued.user.email}
          password={issued.temporaryPassword}
          onDone={() => setIssued(null)}
        />
      )}
      {invited && (
        <div data-testid="invitation-sent">
          <Notice title={`Invitation sent to ${invited.invitationSentTo}`}>
            {invited.user.name} chooses a password from the link in the message. If it does not arrive, check the Mail
            page, or send it again from the list below.
          </Notice>
        </div>
      )}
      <InviteForm onInvited={onInvited} />
      <section aria-label="People" className="overflow-x-auto rounded-tool border-2 border-rule bg-panel">
        {users.isPending && <p className="p-4 text-muted">Loading the shop&apos;s people…</p>}
        {users.isError && (
          <div className="p-4">
            <Notice tone="error" title="Could not load the people">
              {users.error.message}
            </Notice>
          </div>
        )}
        {users.data && users.data.users.length === 0 && (
          <p className="p-4 text-muted">Nobody yet. Invite the first person above.</p>
        )}
        {users.data && users.data.users.length > 0 && (
          <table className="w-full text-left">
            <thead className="bg-paper text-sm text-muted">
              <tr>
                <th className="p-3 font-semibold">Person</th>
                <th className="p-3 font-semibold">Role</th>
                <th className="p-3 font-semibold">Account</th>
                <th className="p-3 font-semibold">Last sign-in</th>
                <th className="p-3 font-semibold">Actions</th>
              </tr>
            </thead>
            <tbody>
              {users.data.users.map((u) => (
                <UserRow key={u.id} user={u} isSelf={u.id === selfId} onIssued={setIssued} onInvited={onInvited} />
              ))}
            </tbody>
          </table>
        )}
      </section>
      <p className="text-sm text-muted">
        Every change here is written to the audit trail. The shop always keeps at least one active admin, and nobody
        changes their own role.
      </p>
    </div>
  );
}
