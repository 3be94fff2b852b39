import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { JobFormPage } from "./pages/job-form-page";
import { InspectionPage } from "./pages/inspection-page";

test("installer on a phone: a furnace's return opening judged live, within 375 px", async ({ page }) => {
  test.setTimeout(120_000);
  const inspection = new InspectionPage(page);
  await new SignInPage(page).signInAs("installer");
  const jobForm = new JobFormPage(page);
  await jobForm.gotoNew();
  await jobForm.fill({ "Customer name": "Odile Penhallow", "Street address": "3 Slate Row", "Town or city": "Ambervale" });
  await jobForm.submitCreate();
  await page.waitForURL(/\/jobs\/\d+$/);
  await page.getByRole("button", { name: "Start inspection" }).click();
  await page.waitForURL(/\/inspections\/\d+$/);
  await inspection.waitReady();

  // Without a furnace the section says so in one line.
  await expect(page.locator("#returnAir")).toContainText("Return air is checked for a furnace");
  await page.getByRole("button", { name: "Add appliance" }).click();
  await page.locator("#f-appliances-0-label").fill("Basement furnace");
  await page.locator("#f-appliances-0-inputBtuh").fill("100000");

  // 100,000 Btu/h at 80 % → 80,000 Btu/h output → 160 in² (IMC 918.2, 2 in² per 1,000 Btu/h).
  await page.locator("#f-returnAir-efficiencyPct").fill("80");
  await page.locator("#f-returnAir-airflowCfm").fill("1200");
  await page.getByRole("button", { name: "Add return opening" }).click();
  await page.locator("#f-returnAir-openings-0-space").selectOption("hallway");
  await page.locator("#f-returnAir-openings-0-widthIn").fill("14");
  await page.locator("#f-returnAir-openings-0-heightIn").fill("10");
  await page.locator("#f-returnAir-openings-0-freeAreaShare").fill("1");
  await page.locator("#f-returnAir-openings-0-freeAreaShare").blur();
  await expect(page.locator("#returnAir")).toContainText("140 in² of 160 in² needed");

  await inspection.openFindings();
  await expect(inspection.findingsWith("fail", "return_air.area")).toHaveCount(1);
  await inspection.findingsWith("fail", "return_air.area").first().click();

  // A value out of range is refused with a message naming the field and its range.
  await page.locator("#f-returnAir-efficiencyPct").fill("180");
  await page.locator("#f-returnAir-efficiencyPct").blur();
  await expect(page.locator("#returnAir [role=alert]")).toContainText("Furnace efficiency must be more than 0 and at most 100 %.");
  await page.locator("#f-returnAir-efficiencyPct").fill("80");
  await page.locator("#f-returnAir-efficiencyPct").blur();
  await expect(page.locator("#returnAir [role=alert]")).toHaveCount(0);

  // Nothing in the section is wider than the phone.
  const overflow = await page.locator("#returnAir").evaluate((el) => {
    const right = window.innerWidth;
    return [...el.querySelectorAll("*")].filter((n) => n.getBoundingClientRect().right > right + 1).map((n) => n.id || n.tagName);
  });
  expect(overflow).toEqual([]);
  await page.locator("#returnAir").screenshot({ path: "test-results/return-air-phone.png" });
  await inspection.expectSaved();
});
