import Link from "next/link";
import { requirePageMember } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { PASSWORD_MIN_LENGTH } from "@/lib/auth/password-policy";
import { ChangePasswordForm } from "./change-password-form";
import { SignOutButton } from "@/components/app-shell/sign-out-button";

export const metadata = { title: "Account" };

export default async function AccountPage({ searchParams }: { searchParams: Promise<{ first?: string }> }) {
  const member = await requirePageMember({ allowPasswordChange: true });
  const first = (await searchParams).first === "1" || member.mustChangePassword;
  return (
    <div className="mx-auto max-w-xl space-y-4">
      <h1 className="text-2xl font-bold tracking-tight">Account</h1>
      <div className="card space-y-1 p-4 text-sm">
        <p className="text-base font-semibold">{member.name}</p>
        <p className="text-ink-600">{member.email}</p>
        <p className="text-ink-600">
          {ROLE_LABELS[member.role]} · {member.companyName}
        </p>
      </div>
      {first ? (
        <p role="status" className="rounded-md border-l-4 border-copper-500 bg-copper-50 px-4 py-3 text-sm">
          You signed in with a temporary password. Choose your own password to continue.
        </p>
      ) : null}
      <section className="card space-y-3 p-4" aria-labelledby="password-title">
        <h2 id="password-title" className="text-base font-bold">
          Change password
        </h2>
        <p className="text-sm text-ink-600">
          At least {PASSWORD_MIN_LENGTH} characters. Length matters more than symbols: a few unrelated words work well. Changing it signs you out everywhere else.
        </p>
        <ChangePasswordForm />
      </section>
      {can(member.role, "site_checks.manage") ? (
        <section className="card space-y-2 p-4" aria-labelledby="settings-title">
          <h2 id="settings-title" className="text-base font-bold">
            Company settings
          </h2>
          <Link href="/settings/site-checks" className="font-semibold text-copper-700 underline">
            Site-check list
          </Link>
        </section>
      ) : null}
      <div className="lg:hidden">
        <SignOutButton className="btn-secondary w-full" />
      </div>
    </div>
  );
}
