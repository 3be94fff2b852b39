import { apiRoute, json, parseJsonBody } from "@/lib/api/handler";
import { clientAddress, signIn } from "@/lib/auth/sign-in";
import { signInSchema } from "@/lib/schemas/auth";

export const POST = apiRoute(async (request) => {
  const input = await parseJsonBody(request, signInSchema, 10_000);
  const result = await signIn({
    email: input.email,
    password: input.password,
    client: clientAddress(request.headers),
    userAgent: request.headers.get("user-agent") ?? "",
  });
  return json({ ok: true, next: result.mustChangePassword ? "/account?first=1" : "/jobs" });
});
