import { redirect } from "next/navigation";
import { getCurrentMember } from "@/lib/auth/session";

export default async function Home() {
  const member = await getCurrentMember();
  redirect(member ? "/jobs" : "/sign-in");
}
