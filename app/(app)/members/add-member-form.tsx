"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Field } from "@/components/ui/field";
import { apiFetch, ApiError } from "@/lib/client/api";
import { ROLES, ROLE_LABELS } from "@/lib/auth/roles";

type FieldName = "name" | "email" | "role";
type FieldErrors = Partial<Record<FieldName, string>>;
const FIELD_NAMES: readonly string[] = ["name", "email", "role"] satisfies FieldName[];

/**
 * Adds a member and shows their temporary password once. The form carries no form library and no
 * schema: `memberCreateSchema` checks it on the server and its messages come back per field, so
 * the words are the schema's own and the members page stays light. Nothing typed is cleared
 * unless the member was added.
 */
export function AddMemberForm() {
  const router = useRouter();
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [created, setCreated] = useState<{ email: string; temporaryPassword: string } | null>(null);
  const [submitting, setSubmitting] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const data = new FormData(form);
    setErrors({});
    setFormError(null);
    setCreated(null);
    setSubmitting(true);
    try {
      const result = await apiFetch<{ member: { email: string }; temporaryPassword: string }>("/api/members", {
        method: "POST",
        body: { name: data.get("name"), email: data.get("email"), role: data.get("role") },
      });
      setCreated({ email: result.member.email, temporaryPassword: result.temporaryPassword });
      form.reset();
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError) {
        const fromServer: FieldErrors = {};
        for (const [field, message] of Object.entries(error.fields)) if (FIELD_NAMES.includes(field)) fromServer[field as FieldName] = message;
        setErrors(fromServer);
        setFormError(error.message);
        const first = FIELD_NAMES.find((f) => f in fromServer);
        if (first) (form.elements.namedItem(first) as HTMLElement | null)?.focus();
      } else setFormError("The member could not be added.");
    } finally {
      setSubmitting(false);
    }
  }

  return (
    <section aria-labelledby="add-member-title" className="card h-fit space-y-3 p-4">
      <h2 id="add-member-title" className="text-base font-bold">
        Add a member
      </h2>
      <form method="post" onSubmit={onSubmit} noValidate className="space-y-3">
        <Field id="member-name" label="Name" error={errors.name}>
          <input id="member-name" name="name" autoComplete="off" maxLength={200} className="input" aria-invalid={errors.name ? true : undefined} aria-describedby="member-name-error" />
        </Field>
        <Field id="member-email" label="E-mail" error={errors.email}>
          <input
            id="member-email"
            name="email"
            type="email"
            inputMode="email"
            autoComplete="off"
            className="input"
            aria-invalid={errors.email ? true : undefined}
            aria-describedby="member-email-error"
          />
        </Field>
        <Field id="member-role" label="Role" error={errors.role}>
          <select id="member-role" name="role" defaultValue="installer" className="input" aria-describedby="member-role-error">
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </Field>
        <div aria-live="polite">
          {formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{formError}</p> : null}
        </div>
        <button type="submit" className="btn-primary w-full" disabled={submitting}>
          {submitting ? "Adding…" : "Add member"}
        </button>
      </form>
      {created ? (
        <div role="status" className="rounded-md border border-pass/30 bg-pass-soft p-3 text-sm">
          <p className="font-semibold text-pass">Added {created.email}</p>
          <p className="mt-1 text-ink-800">Give them this temporary password. It is shown only once, and they must change it at first sign-in:</p>
          <p className="mt-2 select-all rounded bg-white px-2 py-1 font-mono text-base" data-testid="temporary-password">
            {created.temporaryPassword}
          </p>
        </div>
      ) : null}
    </section>
  );
}
