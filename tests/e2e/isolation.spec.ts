import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { apiAs } from "./support/api";

test.describe("company isolation", () => {
  test("ids of another company's jobs and members give 404, on the API and on the page", async ({ page, baseURL }) => {
    const other = await apiAs(baseURL!, "otherCompanyAdmin");
    const otherJobs = (await (await other.get("/api/jobs")).json()).items as { id: number; customerName: string }[];
    const otherMembers = (await (await other.get("/api/members")).json()).members as { id: number }[];
    expect(otherJobs.length).toBeGreaterThan(0);

    const mine = await apiAs(baseURL!, "admin");
    const myJobs = (await (await mine.get("/api/jobs?pageSize=100")).json()).items as { id: number; customerName: string }[];
    const otherJob = otherJobs[0]!;
    expect(myJobs.map((j) => j.id)).not.toContain(otherJob.id);

    const read = await mine.get(`/api/jobs/${otherJob.id}`);
    expect(read.status()).toBe(404);
    expect(JSON.stringify(await read.json())).not.toContain(otherJob.customerName);
    const write = await mine.put(`/api/jobs/${otherJob.id}`, {
      data: { customerName: "Taken over", siteStreet: "x", siteCity: "y", version: 1 },
    });
    expect(write.status()).toBe(404);
    expect((await mine.get(`/api/members/${otherMembers[0]!.id}`)).status()).toBe(404);
    expect((await mine.patch(`/api/members/${otherMembers[0]!.id}`, { data: { active: false } })).status()).toBe(404);

    // The other company's job is unchanged.
    const after = await other.get(`/api/jobs/${otherJob.id}`);
    expect((await after.json()).job.customerName).toBe(otherJob.customerName);

    await new SignInPage(page).signInAs("admin");
    await page.goto(`/jobs/${otherJob.id}`);
    await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
    await expect(page.getByText(otherJob.customerName)).toHaveCount(0);
  });
});
