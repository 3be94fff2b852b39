"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { apiFetch } from "@/lib/client/api";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";

/**
 * A member's role and whether they may sign in. Changes go to the members API and the page is
 * refreshed from the server; a refused change says why beside the member it concerns.
 */
export function MemberActions({ member, isSelf }: { member: { id: number; name: string; role: Role; active: boolean }; isSelf: boolean }) {
  const router = useRouter();
  // The parent keys this component by the saved role and state, so a saved change remounts it.
  const [role, setRole] = useState<Role>(member.role);
  const [error, setError] = useState<string | null>(null);
  const [sending, setSending] = useState(false);
  const [refreshing, startRefresh] = useTransition();
  const busy = sending || refreshing;

  async function change(patch: { role?: Role; active?: boolean }) {
    setError(null);
    setSending(true);
    try {
      await apiFetch(`/api/members/${member.id}`, { method: "PATCH", body: patch });
    } catch (failure) {
      setRole(member.role);
      setError(failure instanceof Error ? failure.message : "The change was not saved.");
    } finally {
      setSending(false);
      startRefresh(() => router.refresh());
    }
  }

  return (
    <>
      <label className="sr-only" htmlFor={`role-${member.id}`}>
        Role of {member.name}
      </label>
      <select
        id={`role-${member.id}`}
        className="input w-auto"
        value={role}
        disabled={isSelf || busy}
        onChange={(e) => {
          const next = e.target.value as Role;
          setRole(next);
          void change({ role: next });
        }}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </select>
      {isSelf ? null : member.active ? (
        <button type="button" className="btn-danger" disabled={busy} onClick={() => change({ active: false })}>
          Deactivate
        </button>
      ) : (
        <button type="button" className="btn-secondary" disabled={busy} onClick={() => change({ active: true })}>
          Reactivate
        </button>
      )}
      {error ? (
        <p role="alert" className="basis-full rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">
          The change was not saved: {error}
        </p>
      ) : null}
    </>
  );
}
