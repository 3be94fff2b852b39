import fs from "node:fs";
import path from "node:path";
import { expect, test } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { RulebookPage } from "./pages/rulebook-page";
import { apiAs } from "./support/api";

const example = JSON.parse(fs.readFileSync(path.join(process.cwd(), "docs/examples/check-request.json"), "utf8"));

async function starter(api: Awaited<ReturnType<typeof apiAs>>) {
  const list = (await (await api.get("/api/rulebooks")).json()).rulebooks as { id: number; name: string; latestVersionNumber: number }[];
  const rb = list.find((r) => r.name.startsWith("Starter rulebook"))!;
  return (await (await api.get(`/api/rulebooks/${rb.id}`)).json()) as { rulebook: { id: number; latestVersionNumber: number }; latest: { id: number; versionNumber: number; content: Record<string, unknown[]> } };
}

test.describe("rulebooks", () => {
  test("an installer reads the starter rulebook with its confidence and demo-data labels, but cannot edit", async ({ page, baseURL }) => {
    await new SignInPage(page).signInAs("installer");
    const rulebook = new RulebookPage(page);
    await rulebook.openStarter();
    await expect(page.getByText("read in the published text, recalled from memory or is common practice — verify every row")).toBeVisible();
    await expect(page.getByText("The capacity table is demo data — invented")).toBeVisible();
    await expect(page.getByText("2018 IFGC 503.10.8; 2018 IRC G2427.10.8 (read in the published text)")).toBeVisible();
    await expect(page.getByRole("button", { name: /Save as version/ })).toHaveCount(0);
    await rulebook.chooseTable("capacity");
    await expect(page.getByText("Demo data — invented, not from any code or manufacturer").first()).toBeVisible();

    const api = await apiAs(baseURL!, "installer");
    const { rulebook: rb, latest } = await starter(api);
    const refused = await api.post(`/api/rulebooks/${rb.id}/versions`, { data: { baseVersionNumber: latest.versionNumber, changeNote: "x", content: latest.content } });
    expect(refused.status()).toBe(403);
  });

  test("a supervisor changes a value with its citation and sees a new version; the old one stays readable", async ({ page, baseURL }) => {
    await new SignInPage(page).signInAs("supervisor");
    const rulebook = new RulebookPage(page);
    await rulebook.openStarter();
    const heading = await page.getByText(/Showing version \d+ of \d+/).textContent();
    const before = Number(/of (\d+)/.exec(heading!)![1]);
    await rulebook.chooseTable("clearances");
    const value = rulebook.cell("Clearance", 1);
    const oldValue = await value.inputValue();
    await value.fill("");
    await value.fill("7");
    await rulebook.cell("Citation", 1).fill("Adopted edition 503.10.5 as amended locally, p. 212");
    await rulebook.saveVersion("Single-wall clearance per our adopted edition");
    await expect(page.getByText(`Showing version ${before + 1} of ${before + 1}`)).toBeVisible();
    await rulebook.chooseTable("clearances");
    await expect(rulebook.cell("Clearance", 1)).toHaveValue("7");
    await expect(page.getByText("Single-wall clearance per our adopted edition")).toBeVisible();

    await page.getByRole("link", { name: new RegExp(`^Version ${before}\\b`) }).click();
    await expect(page.getByText("This is an older version, kept unchanged")).toBeVisible();
    await rulebook.chooseTable("clearances");
    await expect(page.getByText(oldValue, { exact: true }).first()).toBeVisible();

    // A check against the new version cites it.
    const api = await apiAs(baseURL!, "supervisor");
    const { latest } = await starter(api);
    const check = await api.post("/api/check", { data: { ...example, rulebookVersionId: latest.id } });
    expect(check.status()).toBe(200);
    const result = await check.json();
    expect(result.rulebook.versionNumber).toBe(before + 1);
    expect(result.findings.every((f: { rulebookVersion: string }) => f.rulebookVersion.endsWith(`version ${before + 1}`))).toBe(true);
    expect(result.findings.some((f: { citation: string | null }) => f.citation?.includes("Adopted edition 503.10.5"))).toBe(true);
  });

  test("bad rulebook content is refused with messages that say what to fix; a stale edit is a conflict", async ({ baseURL }) => {
    const api = await apiAs(baseURL!, "supervisor");
    const { rulebook, latest } = await starter(api);
    const content = structuredClone(latest.content) as Record<string, Record<string, unknown>[]>;
    content.supportSpacing![0]!.maxSpacingFt = -4;
    content.capacity![0]!.fanMinBtuh = 900_000;
    const bad = await api.post(`/api/rulebooks/${rulebook.id}/versions`, { data: { baseVersionNumber: latest.versionNumber, changeNote: "broken", content } });
    expect(bad.status()).toBe(400);
    const body = await bad.json();
    expect(body.error.code).toBe("validation_failed");
    const messages = Object.values(body.error.fields).join(" ");
    expect(messages).toMatch(/must not be negative|at least 0/);
    expect(messages).toMatch(/below|less than|greater than|above/i);

    const stale = await api.post(`/api/rulebooks/${rulebook.id}/versions`, { data: { baseVersionNumber: latest.versionNumber - 0 + 100, changeNote: "stale", content: latest.content } });
    expect(stale.status()).toBe(409);
    const missingNote = await api.post(`/api/rulebooks/${rulebook.id}/versions`, { data: { baseVersionNumber: latest.versionNumber, changeNote: "", content: latest.content } });
    expect(missingNote.status()).toBe(400);
  });

  test("CSV export downloads a table; a bad CSV import lists its line errors and changes nothing", async ({ page, baseURL }, testInfo) => {
    const api = await apiAs(baseURL!, "supervisor");
    const { rulebook, latest } = await starter(api);
    const csv = await api.get(`/api/rulebooks/${rulebook.id}/versions/${latest.versionNumber}/csv/terminationHeights`);
    expect(csv.status()).toBe(200);
    expect(csv.headers()["content-type"]).toContain("text/csv");
    const text = await csv.text();
    expect(text.split("\r\n")[0]).toBe("pitchFromPer12,pitchToPer12,minHeightFt,citation");

    await new SignInPage(page).signInAs("supervisor");
    await page.goto(`/rulebooks/${rulebook.id}`);
    const rb = new RulebookPage(page);
    await rb.chooseTable("terminationHeights");
    const badFile = testInfo.outputPath("bad.csv");
    fs.writeFileSync(badFile, "pitchFromPer12,pitchToPer12,minHeightFt,citation\r\n0,6,1,ok\r\nsix,7,1.25,typo here\r\n");
    await page.getByLabel("CSV file to import into this table").setInputFiles(badFile);
    await expect(page.getByTestId("csv-errors")).toContainText("Line 3");
    await expect(rb.cell("Min height", 1)).toHaveValue(String((latest.content.terminationHeights![0] as { minHeightFt: number }).minHeightFt));

    // A good file is shown as a change list first: cancelling leaves the table as it was; applying changes it.
    const rows = latest.content.terminationHeights as { pitchFromPer12: number; pitchToPer12: number; minHeightFt: number; citation: string }[];
    const edited = rows.map((r, i) => (i === 0 ? { ...r, minHeightFt: r.minHeightFt + 0.5, citation: "Adopted edition, local amendment 7" } : r)).slice(0, -1);
    const goodFile = testInfo.outputPath("good.csv");
    fs.writeFileSync(goodFile, ["pitchFromPer12,pitchToPer12,minHeightFt,citation", ...edited.map((r) => `${r.pitchFromPer12},${r.pitchToPer12},${r.minHeightFt},"${r.citation}"`)].join("\r\n"));
    const input = page.getByLabel("CSV file to import into this table");
    await input.setInputFiles(goodFile);
    const preview = page.getByTestId("csv-preview");
    await expect(preview.getByTestId("csv-preview-summary")).toHaveText(`0 rows added, 1 changed, 1 removed, ${rows.length - 2} unchanged.`);
    await expect(preview.getByTestId("csv-preview-changed")).toContainText(`Min height: ${rows[0]!.minHeightFt} ft → ${rows[0]!.minHeightFt + 0.5} ft`);
    await expect(rb.cell("Min height", 1)).toHaveValue(String(rows[0]!.minHeightFt));
    await preview.getByRole("button", { name: "Cancel import" }).click();
    await expect(preview).toHaveCount(0);
    await expect(rb.cell("Min height", 1)).toHaveValue(String(rows[0]!.minHeightFt));

    await input.setInputFiles(goodFile);
    await page.getByRole("button", { name: "Apply to the table" }).click();
    await expect(rb.cell("Min height", 1)).toHaveValue(String(rows[0]!.minHeightFt + 0.5));
    await expect(rb.cell("Citation", 1)).toHaveValue("Adopted edition, local amendment 7");
    await expect(rb.cell("Min height", rows.length)).toHaveCount(0);
  });

  test("POST /api/check: the documented example works, bad input gets field errors, another company's version is 404", async ({ baseURL }) => {
    const api = await apiAs(baseURL!, "installer");
    const ok = await api.post("/api/check", { data: { ...example, rulebookVersionId: undefined } });
    expect(ok.status()).toBe(200);
    const result = await ok.json();
    expect(result.summary.total).toBe(result.findings.length);
    expect(result.findings.map((f: { code: string }) => f.code)).toEqual(expect.arrayContaining(["connector.slope", "vent.capacity", "air.volume", "readings.co_air_free"]));
    for (const f of result.findings) {
      expect(["pass", "not-applicable", "fail", "warn", "needs-info"]).toContain(f.status);
      expect(typeof f.message).toBe("string");
    }

    const bad = await api.post("/api/check", { data: { appliances: [] } });
    expect(bad.status()).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toContain("appliances");
    // A value outside its physical range names the field, the range and the unit.
    const huge = await api.post("/api/check", { data: { appliances: [{ id: "a", inputBtuh: 20_000_000 }] } });
    expect(huge.status()).toBe(400);
    const hugeBody = await huge.json();
    expect(hugeBody.error.code).toBe("validation_failed");
    expect(hugeBody.error.fields["appliances.0.inputBtuh"]).toBe("Input must be between 0 and 10,000,000 Btu/h.");

    const other = await apiAs(baseURL!, "otherCompanyAdmin");
    const { latest: otherLatest } = await starter(other);
    const foreign = await api.post("/api/check", { data: { ...example, rulebookVersionId: otherLatest.id } });
    expect(foreign.status()).toBe(404);
  });
});
