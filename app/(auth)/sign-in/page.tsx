import { redirect } from "next/navigation";
import { getCurrentMember } from "@/lib/auth/session";
import { SignInForm } from "./sign-in-form";

export const metadata = { title: "Sign in" };

export default async function SignInPage() {
  if (await getCurrentMember()) redirect("/jobs");
  return (
    <div className="card p-6">
      <h1 className="text-lg font-bold">Sign in</h1>
      <p className="mt-1 text-sm text-ink-600">Use the e-mail address your company registered for you.</p>
      <SignInForm />
    </div>
  );
}
