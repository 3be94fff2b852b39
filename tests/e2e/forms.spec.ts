import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { apiAs } from "./support/api";

/*
 * The forms the server checks (useServerForm): each bad field gets the zod schema's message from
 * the handler, what was typed stays, and a good save shows what was stored.
 */

test.describe("forms checked on the server", () => {
  test("job details: a bad phone number is refused beside its field; a save shows the job as stored", async ({ page, baseURL }) => {
    const api = await apiAs(baseURL!, "supervisor");
    const created = await api.post("/api/jobs", { data: { customerName: "Wendeline Arkwright", siteStreet: "4 Tallow Row", siteCity: "Fennick" } });
    expect(created.status()).toBe(201);
    const { job } = await created.json();

    await new SignInPage(page).signInAs("supervisor");
    await page.goto(`/jobs/${job.id}`);
    await page.getByText("Job details").click();
    await page.getByLabel("Phone").fill("call me");
    await page.getByLabel("E-mail").fill("Wendeline.Arkwright@Example.TEST");
    await page.getByRole("button", { name: "Save changes" }).click();
    // lib/schemas/job.ts words it.
    await expect(page.locator("#job-customerPhone-error")).toHaveText("Enter a phone number using digits, spaces, + ( ) - or .");
    await expect(page.getByLabel("Phone")).toBeFocused();
    await expect(page.getByLabel("E-mail")).toHaveValue("Wendeline.Arkwright@Example.TEST");

    await page.getByLabel("Phone").fill("+1 555 0100");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect(page.getByText("Saved.", { exact: true })).toBeVisible();
    await expect(page.getByLabel("E-mail")).toHaveValue("wendeline.arkwright@example.test");
    await expect(page.locator("#job-customerPhone-error")).toHaveText("");
    const stored = (await (await api.get(`/api/jobs/${job.id}`)).json()).job;
    expect(stored.customerPhone).toBe("+1 555 0100");
    expect(stored.customerEmail).toBe("wendeline.arkwright@example.test");

    // A second edit starts from the new version, not a conflict.
    await page.getByLabel("Notes").fill("Side gate code on the job sheet.");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect(page.getByText("Saved.", { exact: true })).toBeVisible();
    expect((await (await api.get(`/api/jobs/${job.id}`)).json()).job.notes).toBe("Side gate code on the job sheet.");
  });

  test("an installer creates a job assigned to themself, though the installer field is locked", async ({ page, baseURL }) => {
    await new SignInPage(page).signInAs("installer");
    await page.goto("/jobs/new");
    await expect(page.getByLabel("Assigned installer")).toBeDisabled();
    await page.getByRole("button", { name: "Create job" }).click();
    await expect(page.locator("#job-customerName-error")).toHaveText("Enter the customer's name.");
    await expect(page.locator("#job-siteStreet-error")).toHaveText("Enter the street address of the site.");
    await page.getByLabel("Customer name").fill("Barnaby Quillfeather");
    await page.getByLabel("Street address").fill("19 Sorrel Lane");
    await page.getByLabel("Town or city").fill("Fennick");
    await page.getByRole("button", { name: "Create job" }).click();
    await page.waitForURL(/\/jobs\/\d+$/);
    const id = page.url().split("/").pop();
    const api = await apiAs(baseURL!, "installer");
    const me = (await (await api.get("/api/me")).json()).member;
    expect((await (await api.get(`/api/jobs/${id}`)).json()).job.assignedInstallerId).toBe(me.id);
  });

  test("site checks: the admin adds, edits, moves and deactivates an item", async ({ page }) => {
    await new SignInPage(page).signInAs("admin");
    await page.goto("/settings/site-checks");
    await page.getByLabel("What the installer confirms").fill("ok");
    await page.getByRole("button", { name: "Add item" }).click();
    await expect(page.locator("#site-check-label-error")).toHaveText("Write what the installer confirms (at least 3 characters).");

    await page.getByLabel("What the installer confirms").fill("The condensate line drains to a trap");
    await page.getByRole("button", { name: "Add item" }).click();
    await expect(page.getByRole("status")).toContainText("Added “The condensate line drains to a trap”");
    const items = page.getByRole("listitem").filter({ hasText: "The condensate line drains to a trap" });
    await expect(items).toHaveCount(1);
    const all = page.locator("ol > li");
    await expect(all.last()).toContainText("The condensate line drains to a trap");

    await page.getByRole("button", { name: "Move “The condensate line drains to a trap” up" }).click();
    await expect(all.nth((await all.count()) - 2)).toContainText("The condensate line drains to a trap");

    await page.getByRole("button", { name: "Edit “The condensate line drains to a trap”" }).click();
    const edit = page.getByRole("form", { name: "Edit “The condensate line drains to a trap”" });
    await edit.getByLabel("What the installer confirms").fill("The condensate line drains to a trapped outlet");
    await edit.getByRole("button", { name: "Save" }).click();
    await expect(page.getByText("The condensate line drains to a trapped outlet")).toBeVisible();

    await page.getByRole("button", { name: "Deactivate “The condensate line drains to a trapped outlet”" }).click();
    await page.reload();
    const row = page.locator("ol > li").filter({ hasText: "The condensate line drains to a trapped outlet" });
    await expect(row).toContainText("Inactive: not shown to installers");
    await expect(page.locator("ol > li").nth((await page.locator("ol > li").count()) - 2)).toContainText("trapped outlet");
  });

  test("account: two different new passwords are caught before anything is sent", async ({ page }) => {
    await new SignInPage(page).signInAs("installer");
    await page.goto("/account");
    let sent = 0;
    page.on("request", (r) => {
      if (r.url().endsWith("/api/auth/password")) sent += 1;
    });
    await page.getByLabel("Current password").fill("ember-trowel-lantern");
    await page.getByLabel("New password", { exact: true }).fill("harbour lantern quietly");
    await page.getByLabel("Repeat new password").fill("harbour lantern quiet");
    await page.getByRole("button", { name: "Change password" }).click();
    await expect(page.locator("#pw-confirmPassword-error")).toHaveText("The two new passwords differ.");
    await expect(page.getByLabel("Repeat new password")).toBeFocused();
    expect(sent).toBe(0);
    await page.getByLabel("Current password").fill("not-my-password");
    await page.getByLabel("Repeat new password").fill("harbour lantern quietly");
    await page.getByRole("button", { name: "Change password" }).click();
    await expect(page.locator("#pw-currentPassword-error")).not.toHaveText("");
    expect(sent).toBe(1);
  });

  test("check sandbox: the example runs, and JSON that cannot be read says so", async ({ page }) => {
    await new SignInPage(page).signInAs("supervisor");
    await page.goto("/check");
    await page.getByRole("button", { name: "Run check" }).click();
    await expect(page.getByTestId("check-summary")).toContainText("Checked against");
    await page.getByLabel("Check input (JSON)").fill("{ not json");
    await page.getByRole("button", { name: "Run check" }).click();
    await expect(page.getByText("Not valid JSON")).toBeVisible();
  });
});
