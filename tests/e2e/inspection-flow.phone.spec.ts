import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { JobFormPage } from "./pages/job-form-page";
import { InspectionPage } from "./pages/inspection-page";
import { apiAs } from "./support/api";
import { DEMO_ACCOUNTS } from "./support/accounts";

const PHOTO = path.join(process.cwd(), "tests/fixtures/photos/flue-collar.jpg");

async function justifyAll(page: Page) {
  const boxes = page.locator('textarea[id^="f-justifications-"]');
  const count = await boxes.count();
  for (let i = 0; i < count; i++) await boxes.nth(i).fill("Checked with the manufacturer's instructions; allowed as installed.");
}

test.describe.configure({ mode: "serial" });

test("installer on a phone: live fails, fix, drawing, photo, sign and submit; supervisor returns, approves; revision 2", async ({ page, browser, baseURL }) => {
  test.setTimeout(240_000);
  const inspection = new InspectionPage(page);

  // Installer creates the job and starts an inspection.
  await new SignInPage(page).signInAs("installer");
  const jobForm = new JobFormPage(page);
  await jobForm.gotoNew();
  await jobForm.fill({ "Customer name": "Leontine Faraday", "Street address": "8 Cinder Path", "Town or city": "Ambervale" });
  await jobForm.submitCreate();
  await page.waitForURL(/\/jobs\/\d+$/);
  await page.getByRole("button", { name: "Start inspection" }).click();
  await page.waitForURL(/\/inspections\/\d+$/);
  const inspectionId = Number(page.url().split("/").pop());

  // Appliance.
  await page.getByRole("button", { name: "Add appliance" }).click();
  await page.locator("#f-appliances-0-label").fill("Basement furnace");
  await page.locator("#f-appliances-0-inputBtuh").fill("80000");
  await page.locator("#f-appliances-0-outletDiameterIn").fill("4");

  // A too-flat single-wall segment through the attic.
  await page.getByRole("button", { name: "Add connector segment" }).click();
  await page.locator("#f-ventRun-segments-0-material").selectOption("single_wall");
  await page.locator("#f-ventRun-segments-0-diameterIn").fill("4");
  await inspection.fillLength("Length", "10");
  await page.locator("#f-ventRun-segments-0-riseIn").fill("1");
  await page.locator("#f-ventRun-segments-0-passesThrough").selectOption("attic");
  await page.locator("#f-ventRun-segments-0-riseIn").blur();

  await inspection.openFindings();
  await expect(inspection.findingsWith("fail", "connector.slope")).toHaveCount(1);
  await expect(inspection.findingsWith("fail", "passage.single_wall")).toHaveCount(1);
  await expect(page.getByRole("dialog", { name: "Findings" }).getByText(/Single-wall pipe in a concealed or unconditioned space/).first()).toBeVisible();
  // Tapping a finding jumps to its field.
  await inspection.findingsWith("fail", "connector.slope").first().click();
  await expect(page.locator("#f-ventRun-segments-0-riseIn")).toBeFocused();

  const drawingSummary = page.locator("#ventRun svg[role=img]").filter({ visible: true }).first().locator("desc");
  const failingBefore = (await drawingSummary.textContent()) ?? "";
  expect(failingBefore).toMatch(/fail/i);
  expect(failingBefore).toMatch(/slope/i);

  // Fix both.
  await page.locator("#f-ventRun-segments-0-riseIn").fill("3");
  await page.locator("#f-ventRun-segments-0-passesThrough").selectOption("none");
  await page.locator("#f-ventRun-segments-0-riseIn").blur();
  await inspection.openFindings();
  await expect(inspection.findingsWith("fail", "connector.slope")).toHaveCount(0);
  await expect(inspection.findingsWith("fail", "passage.single_wall")).toHaveCount(0);
  await inspection.closeFindings();
  await expect(drawingSummary).not.toHaveText(failingBefore);
  await expect(drawingSummary).not.toContainText(/slope/i);

  // A photo.
  await page.getByTestId("photo-file-input").setInputFiles(PHOTO);
  await expect(page.getByTestId("photo-card")).toHaveCount(1, { timeout: 20_000 });

  await inspection.expectSaved();

  // Justify what remains, sign and submit.
  await justifyAll(page);
  const submitSection = page.locator("#submit");
  await inspection.drawSignature(submitSection);
  await inspection.expectSaved();
  await submitSection.getByRole("button", { name: "Sign and submit for review" }).click();
  await expect(page.getByText("Awaiting review").first()).toBeVisible({ timeout: 20_000 });

  // Supervisor returns it with a comment (desktop).
  const supervisorContext = await browser.newContext({ baseURL, viewport: { width: 1280, height: 900 } });
  const sup = await supervisorContext.newPage();
  await new SignInPage(sup).signInAs("supervisor");
  await sup.goto("/review");
  await sup.getByRole("link", { name: "Leontine Faraday" }).click();
  await sup.waitForURL(new RegExp(`/inspections/${inspectionId}$`));
  await sup.locator("#comment-section").selectOption("ventRun");
  await sup.locator("#comment-body").fill("Add a second support on segment 1.");
  await sup.getByRole("button", { name: "Add comment" }).click();
  await sup.getByRole("button", { name: /Return with 1 comment/ }).click();
  await expect(sup.getByText("Returned for fixes").first()).toBeVisible();

  // Installer sees the comment, fixes and resubmits.
  await page.reload();
  await expect(page.getByText("Add a second support on segment 1.")).toBeVisible();
  await page.locator("#f-ventRun-segments-0-supportsInstalled").fill("2");
  await page.locator("#f-ventRun-segments-0-supportsInstalled").blur();
  await inspection.expectSaved();
  await justifyAll(page);
  await inspection.drawSignature(submitSection);
  await inspection.expectSaved();
  await submitSection.getByRole("button", { name: "Sign and submit for review" }).click();
  await expect(page.getByText("Awaiting review").first()).toBeVisible({ timeout: 20_000 });

  // Supervisor approves with signature and password.
  await sup.reload();
  await new InspectionPage(sup).drawSignature(sup.locator("#review-title").locator("xpath=.."));
  await sup.getByLabel("Your password, to confirm").fill(DEMO_ACCOUNTS.supervisor.password);
  await sup.getByRole("button", { name: "Approve and sign" }).click();
  await expect(sup.getByRole("heading", { name: "Signed record" })).toBeVisible({ timeout: 20_000 });

  // Locked: the API refuses further edits.
  const api = await apiAs(baseURL!, "installer");
  const current = (await (await api.get(`/api/inspections/${inspectionId}`)).json()).inspection;
  expect(current.status).toBe("approved");
  const edit = await api.put(`/api/inspections/${inspectionId}/draft`, { data: { version: current.version, data: current.data } });
  expect(edit.status()).toBe(422);

  // A correction opens revision 2; revision 1 stays readable.
  await sup.getByRole("button", { name: "Correct: open a new revision" }).click();
  await sup.waitForURL(/\/inspections\/\d+$/);
  await expect(sup.getByText("Revision 2")).toBeVisible();
  expect(Number(sup.url().split("/").pop())).not.toBe(inspectionId);
  const old = await api.get(`/api/inspections/${inspectionId}`);
  expect((await old.json()).inspection.status).toBe("approved");

  // The job's history shows the whole trail.
  await sup.goto(`/jobs/${current.jobId}`);
  for (const text of ["Started inspection", "Submitted for review", "Returned to the installer", "Approved and signed", "Opened revision 2"]) {
    await expect(sup.getByText(text).first()).toBeVisible();
  }
  await supervisorContext.close();
});

test("photo validation: a renamed text file is refused with a clear message", async ({ page, baseURL }) => {
  const api = await apiAs(baseURL!, "installer");
  const jobs = (await (await api.get("/api/jobs?status=in_progress")).json()).items as { id: number }[];
  const { id } = await (await api.post(`/api/jobs/${jobs[0]!.id}/inspections`, { data: {} })).json();
  const refused = await api.post(`/api/inspections/${id}/photos`, {
    multipart: { file: { name: "flue.jpg", mimeType: "image/jpeg", buffer: Buffer.from("this is not a photo at all, just text") } },
  });
  expect(refused.status()).toBe(415);
  expect((await refused.json()).error.message).toMatch(/not a photo/i);

  await new SignInPage(page).signInAs("installer");
  await page.goto(`/inspections/${id}`);
  await new InspectionPage(page).waitReady();
  await page.getByTestId("photo-file-input").setInputFiles(path.join(process.cwd(), "tests/fixtures/photos/not-a-photo.jpg"));
  await expect(page.getByTestId("photo-upload-error")).toContainText(/not a photo/i);
});

test("autosave survives a refresh, and two editors get a conflict instead of an overwrite", async ({ page, baseURL }) => {
  const api = await apiAs(baseURL!, "installer");
  const jobs = (await (await api.get("/api/jobs?status=in_progress")).json()).items as { id: number }[];
  const { id } = await (await api.post(`/api/jobs/${jobs[0]!.id}/inspections`, { data: {} })).json();
  const inspection = new InspectionPage(page);
  await new SignInPage(page).signInAs("installer");
  await page.goto(`/inspections/${id}`);
  await inspection.waitReady();
  const saved = page.waitForResponse((r) => r.url().endsWith(`/api/inspections/${id}/draft`) && r.request().method() === "PUT" && r.ok());
  await page.locator("#f-notes").fill("Flue collar re-sealed; customer told about the CO alarm.");
  await saved;
  await inspection.expectSaved();
  await page.reload();
  await inspection.waitReady();
  await expect(page.locator("#f-notes")).toHaveValue("Flue collar re-sealed; customer told about the CO alarm.");

  // Someone else saves in between.
  const other = await apiAs(baseURL!, "supervisor");
  const fresh = (await (await other.get(`/api/inspections/${id}`)).json()).inspection;
  expect((await other.put(`/api/inspections/${id}/draft`, { data: { version: fresh.version, data: { ...fresh.data, notes: "Supervisor's note" } } })).status()).toBe(200);
  const stale = await other.put(`/api/inspections/${id}/draft`, { data: { version: fresh.version, data: fresh.data } });
  expect(stale.status()).toBe(409);
  // A value out of its physical range is refused with the field, the range and the unit.
  const outOfRange = await other.put(`/api/inspections/${id}/draft`, { data: { version: fresh.version + 1, data: { ...fresh.data, readings: [{ applianceId: "x", flueO2Pct: 25 }] } } });
  expect(outOfRange.status()).toBe(400);
  expect((await outOfRange.json()).error.fields["data.readings.0.flueO2Pct"]).toBe("Flue O2 must be between 0 and 20.9 %.");

  await page.locator("#f-notes").fill("Installer's later note");
  await expect(page.getByRole("alert").filter({ hasText: /Someone else saved/ })).toBeVisible({ timeout: 15_000 });
  await expect(page.getByRole("button", { name: "Keep my changes and save over it" })).toBeVisible();
});

test("roles on inspection routes: installers cannot approve, return or see the queue; other companies get 404", async ({ baseURL }) => {
  const installer = await apiAs(baseURL!, "installer");
  const jobs = (await (await installer.get("/api/jobs?status=in_progress")).json()).items as { id: number }[];
  const { id } = await (await installer.post(`/api/jobs/${jobs[0]!.id}/inspections`, { data: {} })).json();
  expect((await installer.get("/api/inspections?status=submitted")).status()).toBe(403);
  expect((await installer.post(`/api/inspections/${id}/approve`, { data: { signature: { typedName: "X Y", signaturePng: "data:image/png;base64,AA==" }, password: "x" } })).status()).toBe(403);
  expect((await installer.post(`/api/inspections/${id}/return`, { data: { comments: [{ section: "general", body: "x" }] } })).status()).toBe(403);
  expect((await installer.post(`/api/inspections/${id}/revise`)).status()).toBe(403);

  const other = await apiAs(baseURL!, "otherCompanyAdmin");
  expect((await other.get(`/api/inspections/${id}`)).status()).toBe(404);
  expect((await other.put(`/api/inspections/${id}/draft`, { data: { version: 1, data: {} } })).status()).toBe(404);
  expect((await other.get(`/api/inspections/${id}/photos`)).status()).toBe(404);
  expect((await other.post(`/api/jobs/${jobs[0]!.id}/inspections`, { data: {} })).status()).toBe(404);

  const signedOut = await (await import("@playwright/test")).request.newContext({ baseURL });
  expect((await signedOut.get(`/api/inspections/${id}`)).status()).toBe(401);
  expect((await signedOut.put(`/api/inspections/${id}/draft`, { data: { version: 1, data: {} } })).status()).toBe(401);
});

test("before its script runs, the editor's fields are disabled, so nothing typed can miss the autosave", async ({ page, baseURL }) => {
  const api = await apiAs(baseURL!, "installer");
  const jobs = (await (await api.get("/api/jobs?status=in_progress")).json()).items as { id: number }[];
  const { id } = await (await api.post(`/api/jobs/${jobs[0]!.id}/inspections`, { data: {} })).json();
  await new SignInPage(page).signInAs("installer");

  // Hold the page's script files (not its styles): the server-rendered editor is on screen (its
  // inline scripts still reveal the streamed parts) but React has not hydrated it, as on a slow phone.
  const held: (() => Promise<void>)[] = [];
  await page.route("**/_next/static/chunks/*.js", (route) => {
    held.push(() => route.continue());
  });
  await page.goto(`/inspections/${id}`, { waitUntil: "domcontentloaded" });
  await expect(page.locator("#f-notes")).toBeVisible();
  await expect(page.locator("#f-notes")).toBeDisabled();
  await expect(page.getByRole("button", { name: "Add appliance" })).toBeDisabled();
  expect(held.length).toBeGreaterThan(0);

  // Once the scripts arrive and the editor runs, the same fields take input.
  await Promise.all(held.map((release) => release()));
  await page.unroute("**/_next/static/chunks/*.js");
  await new InspectionPage(page).waitReady();
  await expect(page.locator("#f-notes")).toBeEnabled();
  await expect(page.getByRole("button", { name: "Add appliance" })).toBeEnabled();
});
