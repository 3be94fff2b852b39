"use client";

import { useState } from "react";
import { apiFetch } from "@/lib/client/api";

export function SignOutButton({ className = "" }: { className?: string }) {
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      disabled={busy}
      className={className}
      onClick={async () => {
        setBusy(true);
        try {
          await apiFetch("/api/auth/sign-out", { method: "POST" });
        } finally {
          window.location.assign("/sign-in");
        }
      }}
    >
      {busy ? "Signing out…" : "Sign out"}
    </button>
  );
}
