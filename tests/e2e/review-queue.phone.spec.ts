import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";

test.describe("review queue on a 375 px phone", () => {
  test("one card per inspection, nothing scrolls sideways, and the status filter is kept in the address", async ({ page }) => {
    await new SignInPage(page).signInAs("supervisor");
    await page.goto("/review");
    await page.getByLabel("Status").selectOption("all");
    await expect(page).toHaveURL(/\/review\?status=all$/);
    const cards = page.getByRole("list", { name: "Inspections" }).getByRole("listitem");
    await expect(cards.first()).toBeVisible();
    // Each card names the customer and links to the inspection.
    await expect(cards.first().getByRole("link")).toHaveAttribute("href", /^\/inspections\/\d+$/);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
    await page.reload();
    await expect(page.getByLabel("Status")).toHaveValue("all");
  });
});
