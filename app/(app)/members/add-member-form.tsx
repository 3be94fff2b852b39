"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Field } from "@/components/ui/field";
import { useServerForm } from "@/components/ui/use-server-form";
import { apiFetch } from "@/lib/client/api";
import { ROLES, ROLE_LABELS } from "@/lib/auth/roles";

const FIELDS = ["name", "email", "role"] as const;

/**
 * Adds a member and shows their temporary password once. No form library and no schema in the
 * browser: `memberCreateSchema` checks the form on the server and its messages come back per
 * field (see useServerForm). Nothing typed is cleared unless the member was added.
 */
export function AddMemberForm() {
  const router = useRouter();
  const form = useServerForm(FIELDS);
  const [created, setCreated] = useState<{ email: string; temporaryPassword: string } | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget;
    setCreated(null);
    await form.submit(
      element,
      async (values) => {
        const result = await apiFetch<{ member: { email: string }; temporaryPassword: string }>("/api/members", { method: "POST", body: values });
        setCreated({ email: result.member.email, temporaryPassword: result.temporaryPassword });
        element.reset();
        router.refresh();
      },
      { failure: "The member could not be added." },
    );
  }

  return (
    <section aria-labelledby="add-member-title" className="card h-fit space-y-3 p-4">
      <h2 id="add-member-title" className="text-base font-bold">
        Add a member
      </h2>
      <form method="post" onSubmit={onSubmit} noValidate className="space-y-3">
        <Field id="member-name" label="Name" error={form.errors.name}>
          <input autoComplete="off" maxLength={200} className="input" {...form.fieldProps("name", "member-name")} />
        </Field>
        <Field id="member-email" label="E-mail" error={form.errors.email}>
          <input type="email" inputMode="email" autoComplete="off" className="input" {...form.fieldProps("email", "member-email")} />
        </Field>
        <Field id="member-role" label="Role" error={form.errors.role}>
          <select defaultValue="installer" className="input" {...form.fieldProps("role", "member-role")}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </Field>
        <div aria-live="polite">
          {form.formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{form.formError}</p> : null}
        </div>
        <button type="submit" className="btn-primary w-full" disabled={!form.ready || form.submitting}>
          {form.submitting ? "Adding…" : "Add member"}
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
