import type { Page } from "@playwright/test";

/** The job form, for creating and editing a job. */
export class JobFormPage {
  constructor(private readonly page: Page) {}

  async gotoNew() {
    await this.page.goto("/jobs/new");
  }

  field(label: string) {
    return this.page.getByLabel(label, { exact: true });
  }

  async fill(values: Partial<Record<"Customer name" | "Phone" | "E-mail" | "Street address" | "Town or city" | "Postal code" | "Notes", string>>) {
    for (const [label, value] of Object.entries(values)) await this.field(label).fill(value ?? "");
  }

  async submitCreate() {
    await this.page.getByRole("button", { name: "Create job" }).click();
  }

  fieldError(label: string) {
    return this.page.locator(`#${label}-error`);
  }
}
