import { expect, type Page } from "@playwright/test";
import { DEMO_ACCOUNTS, type DemoRole } from "../support/accounts";

/** The sign-in screen, as any member sees it. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto("/sign-in");
    await expect(this.page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  }

  async signIn(email: string, password: string) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  async signInAs(role: DemoRole) {
    await this.goto();
    const account = DEMO_ACCOUNTS[role];
    await this.signIn(account.email, account.password);
    await this.page.waitForURL(/\/jobs/);
  }

  errorMessage() {
    return this.page.locator("form").getByRole("alert");
  }
}
