import { apiRoute, json } from "@/lib/api/handler";
import { signOut } from "@/lib/auth/sign-in";

export const POST = apiRoute(async () => {
  await signOut();
  return json({ ok: true });
});
