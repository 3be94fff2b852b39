import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { JobFormPage } from "./pages/job-form-page";
import { InspectionPage } from "./pages/inspection-page";

test("installer on a phone: a furnace and a water heater on one common vent, each with its own connector in the list and the drawing", async ({ page }) => {
  test.setTimeout(120_000);
  const inspection = new InspectionPage(page);
  await new SignInPage(page).signInAs("installer");
  const jobForm = new JobFormPage(page);
  await jobForm.gotoNew();
  await jobForm.fill({ "Customer name": "Odile Marchetti", "Street address": "3 Quillon Row", "Town or city": "Ambervale" });
  await jobForm.submitCreate();
  await page.waitForURL(/\/jobs\/\d+$/);
  await page.getByRole("button", { name: "Start inspection" }).click();
  await page.waitForURL(/\/inspections\/\d+$/);
  await inspection.waitReady();

  await page.getByRole("button", { name: "Add appliance" }).click();
  await page.locator("#f-appliances-0-label").fill("Basement furnace");
  await page.locator("#f-appliances-0-inputBtuh").fill("100000");
  await page.getByRole("button", { name: "Add appliance" }).click();
  await page.locator("#f-appliances-1-label").fill("Water heater");
  await page.locator("#f-appliances-1-kind").selectOption("water_heater");
  await page.locator("#f-appliances-1-draft").selectOption("natural");
  await page.locator("#f-appliances-1-inputBtuh").fill("40000");
  await page.locator("#f-appliances-1-inputBtuh").blur();

  // Both appliances are on the vent (neither is direct-vent): one "add" button each, no plain one.
  await expect(page.getByRole("button", { name: "Add connector segment", exact: true })).toHaveCount(0);
  const connectors = page.getByRole("list", { name: "Connectors on this common vent" });
  await expect(connectors.getByText("has no connector segment yet")).toHaveCount(2);

  await page.getByRole("button", { name: "Add a connector segment for Water heater" }).click();
  await page.getByRole("button", { name: "Add a connector segment for Basement furnace" }).click();
  await page.getByRole("button", { name: "Add a connector segment for Water heater" }).click();

  // The water heater's second segment joins its first: segments stay grouped by appliance.
  await expect(page.locator("#f-ventRun-segments-0-applianceId")).toHaveValue(/.+/);
  const badges = page.locator('#f-ventRun-segments > li span:text-matches("connector$")');
  await expect(badges).toHaveText(["Water heater connector", "Water heater connector", "Basement furnace connector"]);
  await expect(connectors.getByText("connector: segments 1, 2")).toBeVisible();
  await expect(connectors.getByText("connector: segment 3")).toBeVisible();

  // The drawing shows both appliances, each with its own connector.
  const drawing = page.locator("#ventRun svg[role=img]").filter({ visible: true }).first();
  await expect(drawing.locator("desc")).toContainText("Common vent serving Basement furnace and Water heater (Basement furnace: 1 connector segment; Water heater: 2 connector segments)");
  await expect(drawing.getByText("connector: segments 1–2")).toBeVisible();
  await expect(drawing.getByText("connector: segment 3")).toBeVisible();
  await inspection.expectSaved();
});
