"use client";

import { useEffect, useState, type FormEvent } from "react";
import { Field } from "@/components/ui/field";
import { useHydrated } from "@/components/ui/use-hydrated";
import { apiFetch, ApiError } from "@/lib/client/api";
import { EMAIL_MAX_LENGTH, EMAIL_MESSAGES, EMAIL_MIN_LENGTH, PASSWORD_MESSAGES, SIGN_IN_PASSWORD_MAX_LENGTH } from "@/lib/schemas/auth-messages";

type FieldName = "email" | "password";
type FieldErrors = Partial<Record<FieldName, string>>;

/**
 * The checks worth making before sending, in the words the server uses (the server checks all
 * of it again). The e-mail syntax is the browser's own check of an `type="email"` field.
 */
function checkBeforeSending(email: HTMLInputElement, password: HTMLInputElement): FieldErrors {
  const errors: FieldErrors = {};
  const address = email.value.trim();
  if (address.length < EMAIL_MIN_LENGTH) errors.email = EMAIL_MESSAGES.missing;
  else if (address.length > EMAIL_MAX_LENGTH) errors.email = EMAIL_MESSAGES.tooLong;
  else if (email.validity.typeMismatch) errors.email = EMAIL_MESSAGES.invalid;
  if (password.value.length === 0) errors.password = PASSWORD_MESSAGES.missing;
  else if (password.value.length > SIGN_IN_PASSWORD_MAX_LENGTH) errors.password = PASSWORD_MESSAGES.tooLong;
  return errors;
}

/**
 * Two fields and no form library: the sign-in page is the first thing every member loads, often on
 * a phone, so it carries as little script as it can. The fields are uncontrolled, so whatever was
 * typed before the script ran is what is sent once the button is enabled (it waits for the
 * script, see useHydrated); the form posts (never GETs), so a password can never land in an
 * address even if the browser sent the form itself.
 */
export function SignInForm() {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [submitting, setSubmitting] = useState(false);
  const ready = useHydrated();

  // The page is prerendered, so it cannot see the session: ask, and send a member who is already
  // signed in on to the jobs (the signed-in pages check the session again, as always).
  useEffect(() => {
    const controller = new AbortController();
    fetch("/api/me", { signal: controller.signal, cache: "no-store" })
      .then((response) => {
        if (response.ok) window.location.replace("/jobs");
      })
      .catch(() => undefined);
    return () => controller.abort();
  }, []);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const email = form.elements.namedItem("email") as HTMLInputElement;
    const password = form.elements.namedItem("password") as HTMLInputElement;
    const found = checkBeforeSending(email, password);
    setErrors(found);
    setFormError(null);
    if (found.email || found.password) {
      (found.email ? email : password).focus();
      return;
    }
    setSubmitting(true);
    try {
      const result = await apiFetch<{ next: string }>("/api/auth/sign-in", { method: "POST", body: { email: email.value, password: password.value } });
      window.location.assign(result.next);
    } catch (error) {
      setSubmitting(false);
      if (error instanceof ApiError) {
        const fromServer: FieldErrors = {};
        for (const [field, message] of Object.entries(error.fields)) {
          if (field === "email" || field === "password") fromServer[field] = message;
        }
        setErrors(fromServer);
        setFormError(error.message);
      } else {
        setFormError("Sign-in failed. Try again.");
      }
    }
  }

  return (
    <form method="post" onSubmit={onSubmit} noValidate className="mt-5 space-y-3">
      <Field id="email" label="E-mail" error={errors.email}>
        <input
          id="email"
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          className="input"
          aria-invalid={errors.email ? true : undefined}
          aria-describedby="email-error"
        />
      </Field>
      <Field id="password" label="Password" error={errors.password}>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          className="input"
          aria-invalid={errors.password ? true : undefined}
          aria-describedby="password-error"
        />
      </Field>
      <div aria-live="assertive">
        {formError ? (
          <p role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">
            {formError}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn-primary w-full" disabled={!ready || submitting}>
        {submitting ? "Signing in…" : "Sign in"}
      </button>
      <noscript>
        <p className="text-sm text-ink-600">Signing in needs JavaScript: turn it on for this site, then reload the page.</p>
      </noscript>
    </form>
  );
}
