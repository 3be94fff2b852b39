"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Field } from "@/components/ui/field";
import { apiFetch, ApiError } from "@/lib/client/api";
import { changePasswordSchema, type ChangePasswordInput } from "@/lib/schemas/auth";

export function ChangePasswordForm() {
  const [status, setStatus] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<ChangePasswordInput>({ resolver: zodResolver(changePasswordSchema), defaultValues: { currentPassword: "", newPassword: "", confirmPassword: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setStatus(null);
    try {
      await apiFetch("/api/auth/password", { method: "POST", body: values });
      reset();
      setStatus({ kind: "ok", text: "Password changed. Other sessions have been signed out." });
      window.setTimeout(() => window.location.assign("/jobs"), 1200);
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) setError(field as keyof ChangePasswordInput, { message });
        setStatus({ kind: "error", text: error.message });
      } else setStatus({ kind: "error", text: "The password could not be changed." });
    }
  });

  const input = (name: keyof ChangePasswordInput, label: string, autoComplete: string) => (
    <Field id={`pw-${name}`} label={label} error={errors[name]?.message}>
      <input
        id={`pw-${name}`}
        type="password"
        autoComplete={autoComplete}
        className="input"
        aria-invalid={errors[name] ? true : undefined}
        aria-describedby={`pw-${name}-error`}
        {...register(name)}
      />
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      {input("currentPassword", "Current password", "current-password")}
      {input("newPassword", "New password", "new-password")}
      {input("confirmPassword", "Repeat new password", "new-password")}
      <div aria-live="polite">
        {status ? (
          <p className={`rounded-md px-3 py-2 text-sm font-medium ${status.kind === "ok" ? "bg-pass-soft text-pass" : "bg-fail-soft text-fail"}`}>{status.text}</p>
        ) : null}
      </div>
      <button type="submit" className="btn-primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Change password"}
      </button>
    </form>
  );
}
