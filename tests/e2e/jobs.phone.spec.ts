import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { JobFormPage } from "./pages/job-form-page";
import { AppShell } from "./pages/app-shell";
import { apiAs } from "./support/api";

test.describe("jobs on a 375 px phone", () => {
  test("the installer's phone navigation is the bottom bar", async ({ page }) => {
    await new SignInPage(page).signInAs("installer");
    expect(await new AppShell(page).navLabels()).toEqual(["Jobs", "Rulebooks", "Account"]);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(375);
  });

  test("create a job: field errors first and nothing saved, then success", async ({ page, baseURL }) => {
    const api = await apiAs(baseURL!, "installer");
    // Counted by this test's customer, so jobs other tests create at the same time do not count.
    const countQuayle = async () => (await (await api.get("/api/jobs?q=Rosalind%20Quayle")).json()).total as number;
    const before = await countQuayle();

    await new SignInPage(page).signInAs("installer");
    const form = new JobFormPage(page);
    await form.gotoNew();
    await form.fill({ "Customer name": "", "Street address": "31 Bellows Walk", "E-mail": "not-an-email" });
    await form.submitCreate();
    await expect(form.fieldError("job-customerName")).toHaveText("Enter the customer's name.");
    await expect(form.fieldError("job-siteCity")).toHaveText("Enter the town or city.");
    await expect(form.fieldError("job-customerEmail")).toContainText("valid e-mail address");
    await expect(page).toHaveURL(/\/jobs\/new/);
    expect(await countQuayle()).toBe(before);

    await form.fill({ "Customer name": "Rosalind Quayle", "E-mail": "rosalind.q@homeowner.test", "Town or city": "Ambervale", Notes: "Furnace and water heater on a common Type B vent." });
    await form.submitCreate();
    await page.waitForURL(/\/jobs\/\d+$/);
    await expect(page.getByRole("heading", { name: "Rosalind Quayle" })).toBeVisible();
    await expect(page.getByText("Created job")).toBeVisible();
    expect(await countQuayle()).toBe(before + 1);
  });

  test("the server refuses a bad job body with field errors and saves nothing", async ({ baseURL }) => {
    const api = await apiAs(baseURL!, "supervisor");
    const before = (await (await api.get("/api/jobs")).json()).total as number;
    const response = await api.post("/api/jobs", { data: { customerName: "", siteStreet: 42, status: "finished" } });
    expect(response.status()).toBe(400);
    const body = await response.json();
    expect(body.error.code).toBe("validation_failed");
    expect(Object.keys(body.error.fields)).toEqual(expect.arrayContaining(["customerName", "siteStreet", "siteCity", "status"]));
    expect((await (await api.get("/api/jobs")).json()).total).toBe(before);
  });

  test("search, filter and paging of the jobs list", async ({ page }) => {
    await new SignInPage(page).signInAs("supervisor");
    await page.getByLabel("Search").fill("Millrace");
    const list = page.getByRole("list", { name: "Jobs" });
    await expect(list.getByRole("listitem")).toHaveCount(1);
    await expect(list.getByText("Bartholomew Crane")).toBeVisible();
    await page.getByLabel("Search").fill("");
    await page.getByLabel("Status").selectOption("cancelled");
    await expect(list.getByText("Ignatius Pellow")).toBeVisible();
    await expect(list.getByRole("listitem")).toHaveCount(1);
    await page.getByLabel("Search").fill("zzzz-no-such-job");
    await expect(page.getByText("No jobs match")).toBeVisible();
  });

  test("the list's filters live in its address: typing is kept, a reload and a shared link show the same list", async ({ page, browser, baseURL }) => {
    await new SignInPage(page).signInAs("supervisor");
    const list = page.getByRole("list", { name: "Jobs" });
    await page.getByLabel("Search").pressSequentially("Millrace", { delay: 40 });
    await expect(page).toHaveURL(/[?&]q=Millrace(&|$)/);
    await expect(list.getByRole("listitem")).toHaveCount(1);
    await expect(page.getByLabel("Search")).toHaveValue("Millrace");
    await page.getByLabel("Sort").selectOption("customer_asc");
    await expect(page).toHaveURL(/sort=customer_asc/);
    await page.reload();
    await expect(page.getByLabel("Search")).toHaveValue("Millrace");
    await expect(page.getByLabel("Sort")).toHaveValue("customer_asc");
    await expect(list.getByText("Bartholomew Crane")).toBeVisible();

    // The same address opened by someone else of the company shows the same list.
    const other = await browser.newContext({ baseURL, viewport: { width: 375, height: 800 } });
    const otherPage = await other.newPage();
    await new SignInPage(otherPage).signInAs("admin");
    await otherPage.goto(new URL(page.url()).pathname + new URL(page.url()).search);
    await expect(otherPage.getByRole("list", { name: "Jobs" }).getByRole("listitem")).toHaveCount(1);
    await expect(otherPage.getByLabel("Search")).toHaveValue("Millrace");
    await other.close();
  });

  test("opening a job while a search is still waiting for the typing pause stays on the job", async ({ page }) => {
    await new SignInPage(page).signInAs("supervisor");
    const list = page.getByRole("list", { name: "Jobs" });
    await page.getByLabel("Search").pressSequentially("Crane");
    // Tapped before the pause is over: the list still shows every job.
    await list.getByRole("link", { name: /Bartholomew Crane/ }).click();
    await page.waitForURL(/\/jobs\/\d+$/);
    await page.waitForTimeout(1_000);
    await expect(page).toHaveURL(/\/jobs\/\d+$/);
    await expect(page.getByRole("heading", { name: "Bartholomew Crane" })).toBeVisible();
  });

  test("a filter the address gets wrong is explained, and the full list is shown", async ({ page }) => {
    await new SignInPage(page).signInAs("supervisor");
    await page.goto(`/jobs?q=${"x".repeat(150)}`);
    await expect(page.getByRole("status").filter({ hasText: "could not be read" })).toContainText("at most 100 characters");
    await expect(page.getByRole("list", { name: "Jobs" }).getByRole("listitem").first()).toBeVisible();
  });

  test("two people saving the same job: the second gets a conflict, not a silent overwrite", async ({ baseURL }) => {
    const a = await apiAs(baseURL!, "supervisor");
    const b = await apiAs(baseURL!, "admin");
    const created = (await (await a.post("/api/jobs", { data: { customerName: "Conflict Test", siteStreet: "1 Fork Lane", siteCity: "Ambervale" } })).json()).job;
    const base = { customerName: created.customerName, siteStreet: created.siteStreet, siteCity: created.siteCity, version: created.version };
    const first = await a.put(`/api/jobs/${created.id}`, { data: { ...base, notes: "first" } });
    expect(first.status()).toBe(200);
    const second = await b.put(`/api/jobs/${created.id}`, { data: { ...base, notes: "second" } });
    expect(second.status()).toBe(409);
    expect((await second.json()).error.code).toBe("conflict");
    expect((await (await a.get(`/api/jobs/${created.id}`)).json()).job.notes).toBe("first");
  });

  test("an installer cannot assign a job to someone else", async ({ baseURL }) => {
    const api = await apiAs(baseURL!, "installer");
    const installers = (await (await api.get("/api/installers")).json()).installers as { id: number; name: string }[];
    const other = installers.find((m) => m.name !== "Tamsin Wexley")!;
    const response = await api.post("/api/jobs", { data: { customerName: "Assign Test", siteStreet: "2 Fork Lane", siteCity: "Ambervale", assignedInstallerId: other.id } });
    expect(response.status()).toBe(403);
  });
});
