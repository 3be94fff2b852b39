import type { Page } from "@playwright/test";

/** The signed-in shell: navigation and sign-out, in desktop or phone layout. */
export class AppShell {
  constructor(private readonly page: Page) {}

  navigation() {
    return this.page.getByRole("navigation", { name: "Main navigation" }).filter({ visible: true });
  }

  async navLabels(): Promise<string[]> {
    const links = this.navigation().getByRole("link");
    return (await links.allTextContents()).map((t) => t.trim());
  }

  async signOut() {
    const button = this.page.getByRole("button", { name: "Sign out" }).filter({ visible: true }).first();
    await button.click();
    await this.page.waitForURL(/\/sign-in/);
  }
}
