import { SignInForm } from "./sign-in-form";

export const metadata = { title: "Sign in" };

/**
 * Prerendered: the same HTML for everyone, served without rendering (the first page every member
 * loads, and the one a password flood hits). A member who is already signed in is sent on to the
 * jobs by the form's script.
 */
export default function SignInPage() {
  return (
    <div className="card p-6">
      <h1 className="text-lg font-bold">Sign in</h1>
      <p className="mt-1 text-sm text-ink-600">Use the e-mail address your company registered for you.</p>
      <SignInForm />
    </div>
  );
}
