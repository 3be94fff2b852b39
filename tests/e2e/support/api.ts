import { request as playwrightRequest, type APIRequestContext } from "@playwright/test";
import { DEMO_ACCOUNTS, type DemoRole } from "./accounts";

/** A signed-in API client for one demo account, for arranging and checking state in tests. */
export async function apiAs(baseURL: string, role: DemoRole): Promise<APIRequestContext> {
  const context = await playwrightRequest.newContext({ baseURL });
  const account = DEMO_ACCOUNTS[role];
  const response = await context.post("/api/auth/sign-in", { data: { email: account.email, password: account.password } });
  if (!response.ok()) throw new Error(`sign-in as ${role} failed: ${response.status()} ${await response.text()}`);
  return context;
}

export async function apiSignIn(baseURL: string, email: string, password: string): Promise<APIRequestContext> {
  const context = await playwrightRequest.newContext({ baseURL });
  const response = await context.post("/api/auth/sign-in", { data: { email, password } });
  if (!response.ok()) throw new Error(`sign-in as ${email} failed: ${response.status()} ${await response.text()}`);
  return context;
}
