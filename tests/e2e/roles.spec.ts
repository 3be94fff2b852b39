import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { AppShell } from "./pages/app-shell";
import { apiAs } from "./support/api";

const EXPECTED_NAV = {
  installer: ["Jobs", "Rulebooks", "Account"],
  supervisor: ["Jobs", "Review", "Rulebooks", "Account"],
  admin: ["Jobs", "Review", "Rulebooks", "Members", "Site checks", "Account"],
} as const;

test.describe("roles", () => {
  for (const role of ["installer", "supervisor", "admin"] as const) {
    test(`${role} sees only the navigation its role allows`, async ({ page }) => {
      await new SignInPage(page).signInAs(role);
      expect(await new AppShell(page).navLabels()).toEqual(EXPECTED_NAV[role]);
    });
  }

  test("an installer gets the forbidden page for members, and 403 from the members API", async ({ page, baseURL }) => {
    await new SignInPage(page).signInAs("installer");
    await page.goto("/members");
    await expect(page).toHaveURL(/\/forbidden/);
    await expect(page.getByRole("heading", { name: "Your role does not allow this page" })).toBeVisible();
    const api = await apiAs(baseURL!, "installer");
    expect((await api.get("/api/members")).status()).toBe(403);
    const create = await api.post("/api/members", { data: { name: "Sneaky", email: "sneaky@flueward.test", role: "admin" } });
    expect(create.status()).toBe(403);
    expect((await create.json()).error.code).toBe("forbidden");
  });

  test("a supervisor cannot manage members either", async ({ baseURL }) => {
    const api = await apiAs(baseURL!, "supervisor");
    expect((await api.get("/api/members")).status()).toBe(403);
    expect((await api.patch("/api/members/1", { data: { active: false } })).status()).toBe(403);
  });

  test("signed out, APIs answer 401 and pages redirect to sign-in", async ({ page, request }) => {
    expect((await request.get("/api/jobs")).status()).toBe(401);
    expect((await request.get("/api/members")).status()).toBe(401);
    await page.goto("/members");
    await expect(page).toHaveURL(/\/sign-in/);
  });
});
