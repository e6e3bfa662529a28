"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { TextField } from "@/components/ui/text-field";
import { api, ApiError } from "@/lib/client/api";
import { ROLE_WORDS } from "@/lib/nav";
import { inviteUserSchema, type AdminUser, type InviteUserInput, type InviteUserValues } from "@/lib/schemas/user";
import { ROLES } from "@/lib/schemas/enums";

/** A temporary password an admin's reset made, shown once. */
export type Issued = { user: AdminUser; temporaryPassword: string };
/** An invitation on its way: the person chooses their password from the e-mailed link. */
export type Invited = { user: AdminUser; invitationSentTo: string };

export function InviteForm({ onInvited }: { onInvited: (i: Invited) => void }) {
  const qc = useQueryClient();
  const [serverError, setServerError] = useState<string | null>(null);
  const form = useForm<InviteUserValues, unknown, InviteUserInput>({
    resolver: zodResolver(inviteUserSchema),
    defaultValues: { name: "", email: "", role: "machinist" },
  });
  const invite = useMutation({
    mutationFn: (values: InviteUserInput) => api<Invited>("/api/users", { method: "POST", json: values }),
    onSuccess: (invited) => {
      qc.setQueryData<{ users: AdminUser[] }>(["admin-users"], (old) =>
        old ? { users: [...old.users, invited.user] } : old,
      );
      void qc.invalidateQueries({ queryKey: ["admin-users"] });
      form.reset({ name: "", email: "", role: form.getValues("role") });
      onInvited(invited);
    },
    onError: (err) => {
      // Keep what was typed; point at the field the server refused.
      if (err instanceof ApiError && err.fields) {
        for (const [field, msgs] of Object.entries(err.fields)) {
          if (field === "name" || field === "email" || field === "role") form.setError(field, { message: msgs[0] });
        }
      }
      setServerError(
        err instanceof ApiError ? err.message : "Could not reach the server. Check the connection and try again.",
      );
    },
  });
  const onSubmit = form.handleSubmit((values) => {
    setServerError(null);
    invite.mutate(values);
  });
  const errors = form.formState.errors;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label="Invite a person"
      className="flex flex-col gap-4 rounded-tool border-2 border-rule bg-panel p-4"
    >
      <h2 className="text-xl font-semibold">Invite a person</h2>
      {serverError && <Notice tone="error">{serverError}</Notice>}
      <div className="grid gap-4 md:grid-cols-3">
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register("name")} />
        <TextField
          label="E-mail"
          type="email"
          autoComplete="off"
          error={errors.email?.message}
          {...form.register("email")}
        />
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Role</span>
          <select
            className="min-h-12 rounded-tool border-2 border-rule bg-paper px-3 text-lg"
            {...form.register("role")}
          >
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_WORDS[r]}
              </option>
            ))}
          </select>
          {errors.role && <span className="text-sm font-medium text-fail">{errors.role.message}</span>}
        </label>
      </div>
      <div>
        <Button type="submit" disabled={invite.isPending}>
          {invite.isPending ? "Sending the invitation…" : "Send invitation"}
        </Button>
      </div>
      <p className="text-sm text-muted">
        They get an e-mail with a link that works once, for three days, where they choose their own password. Nobody
        else sees it, you included.
      </p>
    </form>
  );
}
