import type { Page } from "@playwright/test";

/** The rulebook screen: table picker, grid cells, CSV, saving a version. */
export class RulebookPage {
  constructor(private readonly page: Page) {}

  async openStarter() {
    await this.page.goto("/rulebooks");
    await this.page.getByRole("link", { name: "Starter rulebook (verify before use)" }).first().click();
    await this.page.waitForURL(/\/rulebooks\/\d+/);
  }

  async chooseTable(key: string) {
    await this.page.getByLabel("Table", { exact: true }).selectOption(key);
  }

  cell(column: string, row: number) {
    return this.page.getByLabel(`${column}, row ${row}`, { exact: true });
  }

  async saveVersion(note: string) {
    await this.page.getByLabel("What changed, and why").fill(note);
    await this.page.getByRole("button", { name: /Save as version/ }).click();
  }
}
