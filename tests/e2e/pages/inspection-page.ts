import { expect, type Locator, type Page } from "@playwright/test";

/** The inspection editor and review screen, as the installer and the supervisor use it. */
export class InspectionPage {
  constructor(private readonly page: Page) {}

  findingsWith(status: string, code: string): Locator {
    return this.page.locator(`li[data-status="${status}"][data-code="${code}"]`).filter({ visible: true });
  }

  /** Opens the phone's findings sheet (no-op on desktop where the column is always shown). */
  async openFindings() {
    const bar = this.page.getByRole("button", { name: /Findings ▲/ });
    if (await bar.isVisible()) await bar.click();
  }

  async closeFindings() {
    const close = this.page.getByRole("dialog", { name: "Findings" }).getByRole("button", { name: "Close" });
    if (await close.isVisible()) await close.click();
  }

  /** Waits until the editor runs in the browser, so what the test types is watched and saved. */
  async waitReady() {
    await expect(this.page.getByTestId("save-status")).toHaveAttribute("data-ready", "true", { timeout: 20_000 });
  }

  async expectSaved() {
    await expect(this.page.getByTestId("save-status")).toContainText(/Saved|All changes saved/, { timeout: 15_000 });
  }

  async fillLength(name: string, feet: string, inches = "") {
    await this.page.getByLabel(`${name}, feet`).first().fill(feet);
    await this.page.getByLabel(`${name}, inches`).first().fill(inches);
    await this.page.getByLabel(`${name}, inches`).first().blur();
  }

  async drawSignature(scope: Locator) {
    const canvas = scope.locator("canvas").first();
    await canvas.evaluate((el) => el.scrollIntoView({ block: "center" }));
    await this.page.waitForTimeout(300);
    const box = (await canvas.boundingBox())!;
    const hit = await this.page.evaluate(([x, y]) => document.elementFromPoint(x!, y!)?.tagName ?? "none", [box.x + box.width / 2, box.y + box.height / 2]);
    if (hit !== "CANVAS") throw new Error(`the signature pad is covered by ${hit} at ${JSON.stringify(box)}`);
    const mouse = this.page.mouse;
    await mouse.move(box.x + 20, box.y + box.height * 0.6);
    await mouse.down();
    for (let i = 1; i <= 12; i++) await mouse.move(box.x + 20 + i * 18, box.y + box.height * (0.6 - 0.3 * Math.sin(i)), { steps: 2 });
    await mouse.up();
  }
}
