import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { AppShell } from "./pages/app-shell";
import { DEMO_ACCOUNTS } from "./support/accounts";

test.describe("sign-in and sign-out", () => {
  test("each demo role signs in and sees its name", async ({ page }) => {
    for (const role of ["installer", "supervisor", "admin"] as const) {
      await page.context().clearCookies();
      await new SignInPage(page).signInAs(role);
      await expect(page.getByRole("heading", { name: "Jobs" })).toBeVisible();
      await expect(page.getByTestId("member-name")).toHaveText(DEMO_ACCOUNTS[role].name);
    }
  });

  test("a wrong password is refused with a clear message and no session", async ({ page }) => {
    const signIn = new SignInPage(page);
    await signIn.goto();
    await signIn.signIn(DEMO_ACCOUNTS.supervisor.email, "not-the-right-password");
    await expect(signIn.errorMessage()).toContainText("do not match an active account");
    await expect(page).toHaveURL(/\/sign-in/);
    const me = await page.request.get("/api/me");
    expect(me.status()).toBe(401);
  });

  test("an unknown e-mail gets the same answer as a wrong password", async ({ request }) => {
    const unknown = await request.post("/api/auth/sign-in", { data: { email: "nobody@flueward.test", password: "whatever-it-is-here" } });
    const wrong = await request.post("/api/auth/sign-in", { data: { email: DEMO_ACCOUNTS.admin.email, password: "whatever-it-is-here" } });
    expect(unknown.status()).toBe(401);
    expect(wrong.status()).toBe(401);
    expect(await unknown.json()).toEqual(await wrong.json());
  });

  test("a deactivated member cannot sign in", async ({ request }) => {
    const response = await request.post("/api/auth/sign-in", { data: { email: DEMO_ACCOUNTS.deactivated.email, password: DEMO_ACCOUNTS.deactivated.password } });
    expect(response.status()).toBe(401);
  });

  test("the sign-in form shows field errors before sending", async ({ page }) => {
    const signIn = new SignInPage(page);
    await signIn.goto();
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.locator("#email-error")).toHaveText("Enter an e-mail address.");
    await expect(page.locator("#password-error")).toHaveText("Enter your password.");
  });

  test("a sign-in cannot be sent before the page's script runs, and never puts the password in the address", async ({ browser, baseURL }) => {
    // With scripts off, the page is what a phone shows before hydration: the button waits, the
    // form names POST in case it is sent anyway, and the page says what is missing.
    const context = await browser.newContext({ baseURL, javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto("/sign-in");
    await expect(page.locator("form")).toHaveAttribute("method", "post");
    await expect(page.getByRole("button", { name: "Sign in" })).toBeDisabled();
    // (The browser's script switch does not change how it parses <noscript>: read the HTML.)
    expect(await (await context.request.get("/sign-in")).text()).toMatch(/<noscript><p[^>]*>Signing in needs JavaScript/);
    await page.getByLabel("E-mail").fill("someone@flueward.test");
    await page.getByLabel("Password").fill("not-in-the-address-please");
    let navigations = 0;
    page.on("request", (r) => {
      if (r.isNavigationRequest()) navigations += 1;
    });
    // Enter in a field of a form whose submit button is disabled sends nothing.
    await page.getByLabel("Password").press("Enter");
    await page.waitForTimeout(500);
    expect(navigations).toBe(0);
    expect(page.url()).not.toContain("not-in-the-address-please");
    await expect(page.getByLabel("Password")).toHaveValue("not-in-the-address-please");
    await context.close();

    // With scripts on, the same button is enabled once the page has hydrated.
    const live = await browser.newPage({ baseURL });
    await live.goto("/sign-in");
    await expect(live.getByRole("button", { name: "Sign in" })).toBeEnabled();
    await live.close();
  });

  test("sign-out ends the session on the server: a replayed cookie is refused", async ({ page, context }) => {
    await new SignInPage(page).signInAs("installer");
    const cookies = await context.cookies();
    expect(cookies.some((c) => c.name.includes("flueward-session") && c.httpOnly)).toBe(true);
    await new AppShell(page).signOut();
    await page.goto("/jobs");
    await expect(page).toHaveURL(/\/sign-in/);
    // Put the old cookie back: the server must refuse it.
    await context.addCookies(cookies);
    const me = await page.request.get("/api/me");
    expect(me.status()).toBe(401);
  });

  test("pages and APIs send security headers and the page runs under its CSP", async ({ page }) => {
    const violations: string[] = [];
    page.on("console", (msg) => {
      if (/Content Security Policy|Refused to (execute|load)/i.test(msg.text())) violations.push(msg.text());
    });
    const response = await page.goto("/sign-in");
    const headers = response!.headers();
    expect(headers["content-security-policy"]).toContain("frame-ancestors 'none'");
    // The sign-in page is prerendered: its inline scripts are allowed by hash, not by a nonce.
    expect(headers["content-security-policy"]).toMatch(/script-src 'self'( 'sha256-[A-Za-z0-9+/=]+')+;/);
    expect(headers["content-security-policy"]).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(headers["x-content-type-options"]).toBe("nosniff");
    expect(headers["referrer-policy"]).toBeTruthy();
    expect(headers["x-powered-by"]).toBeUndefined();
    // The form is interactive only if the page's scripts ran under that policy.
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.locator("#password-error")).toHaveText("Enter your password.");
    expect(violations).toEqual([]);
  });

  test("a member who is already signed in and opens the sign-in page is sent on to the jobs", async ({ page }) => {
    await new SignInPage(page).signInAs("installer");
    await page.goto("/sign-in");
    await expect(page).toHaveURL(/\/jobs/);
  });

  test("a cross-site write is refused", async ({ request }) => {
    const response = await request.post("/api/auth/sign-in", {
      headers: { Origin: "http://attacker.example" },
      data: { email: DEMO_ACCOUNTS.admin.email, password: DEMO_ACCOUNTS.admin.password },
    });
    expect(response.status()).toBe(403);
    expect((await response.json()).error.code).toBe("cross_site_refused");
  });
});
