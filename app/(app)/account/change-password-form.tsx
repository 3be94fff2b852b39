"use client";

import { useState, type FormEvent } from "react";
import { Field } from "@/components/ui/field";
import { useServerForm } from "@/components/ui/use-server-form";
import { apiFetch } from "@/lib/client/api";
import { CHANGE_PASSWORD_MESSAGES } from "@/lib/schemas/auth-messages";

const FIELDS = ["currentPassword", "newPassword", "confirmPassword"] as const;
type PasswordField = (typeof FIELDS)[number];

/**
 * Changes the member's password. `changePasswordSchema` and the password policy (length, the
 * common-password list) run on the server; only the two new passwords are compared here first,
 * in the schema's words, since that needs nothing the browser lacks.
 */
export function ChangePasswordForm() {
  const form = useServerForm(FIELDS);
  const [changed, setChanged] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget;
    setChanged(false);
    const ok = await form.submit(element, (values) => apiFetch("/api/auth/password", { method: "POST", body: values }), {
      failure: "The password could not be changed.",
      checkFirst: (v) => (v.newPassword !== "" && v.confirmPassword !== "" && v.newPassword !== v.confirmPassword ? { confirmPassword: CHANGE_PASSWORD_MESSAGES.differ } : {}),
    });
    if (!ok) return;
    element.reset();
    setChanged(true);
    window.setTimeout(() => window.location.assign("/jobs"), 1200);
  }

  const input = (name: PasswordField, label: string, autoComplete: string) => (
    <Field id={`pw-${name}`} label={label} error={form.errors[name]}>
      <input type="password" autoComplete={autoComplete} className="input" {...form.fieldProps(name, `pw-${name}`)} />
    </Field>
  );

  return (
    <form method="post" onSubmit={onSubmit} noValidate className="space-y-3">
      {input("currentPassword", "Current password", "current-password")}
      {input("newPassword", "New password", "new-password")}
      {input("confirmPassword", "Repeat new password", "new-password")}
      <div aria-live="polite">
        {changed ? <p className="rounded-md bg-pass-soft px-3 py-2 text-sm font-medium text-pass">Password changed. Other sessions have been signed out.</p> : null}
        {form.formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{form.formError}</p> : null}
      </div>
      <button type="submit" className="btn-primary" disabled={!form.ready || form.submitting}>
        {form.submitting ? "Saving…" : "Change password"}
      </button>
    </form>
  );
}
