"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { Field } from "@/components/ui/field";
import { EmptyState, ErrorState, ListSkeleton } from "@/components/ui/states";
import { apiFetch, ApiError } from "@/lib/client/api";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { memberCreateSchema, type MemberCreateInput } from "@/lib/schemas/member";

interface Member {
  id: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  mustChangePassword: boolean;
}

function MembersManagerView({ currentUserId }: { currentUserId: number }) {
  const queryClient = useQueryClient();
  const members = useQuery({ queryKey: ["members"], queryFn: () => apiFetch<{ members: Member[] }>("/api/members") });
  const [rowError, setRowError] = useState<string | null>(null);
  const update = useMutation({
    mutationFn: (args: { id: number; role?: Role; active?: boolean }) =>
      apiFetch<{ member: Member }>(`/api/members/${args.id}`, { method: "PATCH", body: { role: args.role, active: args.active } }),
    onMutate: () => setRowError(null),
    onError: (error) => setRowError(error.message),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ["members"] }),
  });

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
      <section aria-labelledby="members-title" className="space-y-3">
        <h2 id="members-title" className="sr-only">
          Current members
        </h2>
        <div aria-live="polite">{rowError ? <ErrorState title="The change was not saved." message={rowError} /> : null}</div>
        {members.isPending ? (
          <ListSkeleton label="Loading members" />
        ) : members.isError ? (
          <ErrorState title="Members could not be loaded." message={members.error.message} onRetry={() => members.refetch()} />
        ) : members.data.members.length === 0 ? (
          <EmptyState title="No members yet" />
        ) : (
          <ul className="space-y-2">
            {members.data.members.map((m) => (
              <li key={m.id} className={`card flex flex-wrap items-center gap-3 p-3 ${m.active ? "" : "opacity-70"}`} data-testid={`member-${m.email}`}>
                {/* On a phone the name and e-mail take the whole row; the role and button wrap beneath. */}
                <div className="min-w-0 basis-full sm:flex-1 sm:basis-0">
                  <p className="break-words font-semibold">
                    {m.name} {m.id === currentUserId ? <span className="text-xs font-normal text-ink-500">(you)</span> : null}
                  </p>
                  <p className="break-all text-sm text-ink-600 sm:truncate sm:break-normal">{m.email}</p>
                  <p className="text-xs text-ink-500">
                    {m.active ? "Active" : "Deactivated"}
                    {m.mustChangePassword && m.active ? " · temporary password not yet changed" : ""}
                  </p>
                </div>
                <label className="sr-only" htmlFor={`role-${m.id}`}>
                  Role of {m.name}
                </label>
                <select
                  id={`role-${m.id}`}
                  className="input w-auto"
                  value={m.role}
                  disabled={m.id === currentUserId || update.isPending}
                  onChange={(e) => update.mutate({ id: m.id, role: e.target.value as Role })}
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {ROLE_LABELS[r]}
                    </option>
                  ))}
                </select>
                {m.id !== currentUserId ? (
                  m.active ? (
                    <button type="button" className="btn-danger" disabled={update.isPending} onClick={() => update.mutate({ id: m.id, active: false })}>
                      Deactivate
                    </button>
                  ) : (
                    <button type="button" className="btn-secondary" disabled={update.isPending} onClick={() => update.mutate({ id: m.id, active: true })}>
                      Reactivate
                    </button>
                  )
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </section>
      <AddMemberForm onAdded={() => queryClient.invalidateQueries({ queryKey: ["members"] })} />
    </div>
  );
}

function AddMemberForm({ onAdded }: { onAdded: () => void }) {
  const [created, setCreated] = useState<{ email: string; temporaryPassword: string } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<MemberCreateInput>({ resolver: zodResolver(memberCreateSchema), defaultValues: { name: "", email: "", role: "installer" } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setCreated(null);
    try {
      const result = await apiFetch<{ member: { email: string }; temporaryPassword: string }>("/api/members", { method: "POST", body: values });
      setCreated({ email: result.member.email, temporaryPassword: result.temporaryPassword });
      reset();
      onAdded();
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) setError(field as keyof MemberCreateInput, { message });
        setFormError(error.message);
      } else setFormError("The member could not be added.");
    }
  });

  return (
    <section aria-labelledby="add-member-title" className="card h-fit space-y-3 p-4">
      <h2 id="add-member-title" className="text-base font-bold">
        Add a member
      </h2>
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        <Field id="member-name" label="Name" error={errors.name?.message}>
          <input id="member-name" className="input" aria-invalid={errors.name ? true : undefined} {...register("name")} />
        </Field>
        <Field id="member-email" label="E-mail" error={errors.email?.message}>
          <input id="member-email" type="email" inputMode="email" className="input" aria-invalid={errors.email ? true : undefined} {...register("email")} />
        </Field>
        <Field id="member-role" label="Role" error={errors.role?.message}>
          <select id="member-role" className="input" {...register("role")}>
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
        <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>
          {isSubmitting ? "Adding…" : "Add member"}
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

export const MembersManager = withQueryClient(MembersManagerView);
