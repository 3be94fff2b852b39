import { redirect } from "next/navigation";
import { AppShell } from "@/components/app-shell/app-shell";
import { getCurrentMember } from "@/lib/auth/session";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const member = await getCurrentMember();
  if (!member) redirect("/sign-in");
  return <AppShell member={member}>{children}</AppShell>;
}
