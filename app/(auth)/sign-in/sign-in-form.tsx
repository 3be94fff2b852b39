"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Field } from "@/components/ui/field";
import { apiFetch, ApiError } from "@/lib/client/api";
import { signInSchema, type SignInInput } from "@/lib/schemas/auth";

export function SignInForm() {
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const result = await apiFetch<{ next: string }>("/api/auth/sign-in", { method: "POST", body: values });
      window.location.assign(result.next);
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) {
          if (field === "email" || field === "password") setError(field, { message });
        }
        setFormError(error.message);
      } else {
        setFormError("Sign-in failed. Try again.");
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="mt-5 space-y-3">
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input
          id="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          className="input"
          aria-invalid={errors.email ? true : undefined}
          aria-describedby="email-error"
          {...register("email")}
        />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          className="input"
          aria-invalid={errors.password ? true : undefined}
          aria-describedby="password-error"
          {...register("password")}
        />
      </Field>
      <div aria-live="assertive">
        {formError ? (
          <p role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">
            {formError}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
