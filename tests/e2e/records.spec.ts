import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { expect, request as playwrightRequest, test, type APIRequestContext } from "@playwright/test";
import { SignInPage } from "./pages/sign-in-page";
import { apiAs } from "./support/api";
import { signaturePng } from "./support/signature";
import { DEMO_ACCOUNTS } from "./support/accounts";
import { ok, submittedInspection, templateInspectionData, unique } from "./support/world";

const DB_FILE = path.join(process.cwd(), "test-results/e2e-db/flueward.sqlite");
const OUTBOX = path.join(process.cwd(), "test-results/e2e-outbox");

test.describe.configure({ mode: "serial" });

/**
 * Approves a submitted inspection made for this test from an approved demo inspection's data, so
 * nothing else running at the same time (another worker, a retry of this file) approves it first.
 */
async function approveSubmitted(api: APIRequestContext, baseURL: string) {
  const admin = await apiAs(baseURL, "admin");
  const { job } = await ok(await admin.post("/api/jobs", { data: { customerName: `Records Test ${unique("job")}`, siteStreet: "2 Test Row", siteCity: "Testbury", status: "in_progress" } }), "create job");
  const target = { id: await submittedInspection({ admin, jobId: job.id, templateData: await templateInspectionData(admin) }) };
  const approve = await api.post(`/api/inspections/${target.id}/approve`, { data: { signature: { typedName: DEMO_ACCOUNTS.supervisor.name, signaturePng: await signaturePng() }, password: DEMO_ACCOUNTS.supervisor.password } });
  expect(approve.status(), await approve.text()).toBe(200);
  const record = (await (await api.get(`/api/inspections/${target.id}/record`)).json()).records[0];
  return { inspectionId: target.id, record };
}

async function outbox(api: APIRequestContext) {
  return (await (await api.get("/api/dev/outbox")).json()).messages as { id: string; to: string[]; subject: string; text: string; links: string[]; attachments: { filename: string; sha256: string }[] }[];
}

test("approval renders a stored PDF; its bytes verify; one changed byte does not", async ({ baseURL }) => {
  const api = await apiAs(baseURL!, "supervisor");
  const { record } = await approveSubmitted(api, baseURL!);
  expect(record.status).toBe("valid");
  const pdf = await api.get(`/api/records/${record.id}/pdf`);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  const bytes = await pdf.body();
  expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
  expect(crypto.createHash("sha256").update(bytes).digest("hex")).toBe(record.sha256);
  // Every download serves the same stored bytes.
  expect((await (await api.get(`/api/records/${record.id}/pdf`)).body()).equals(bytes)).toBe(true);

  const anon = await playwrightRequest.newContext({ baseURL });
  const byCode = await (await anon.get(`/api/verify?code=${encodeURIComponent(record.verificationCode)}`)).json();
  expect(byCode.result).toMatchObject({ found: true, status: "valid", sha256: record.sha256, supervisorName: DEMO_ACCOUNTS.supervisor.name });

  const good = await anon.post("/api/verify", { multipart: { file: { name: "record.pdf", mimeType: "application/pdf", buffer: bytes }, code: record.verificationCode } });
  expect((await good.json()).matches).toBe(true);
  const tampered = Buffer.from(bytes);
  const middle = Math.floor(tampered.length / 2);
  tampered[middle] = (tampered[middle] ?? 0) ^ 0x01;
  const bad = await anon.post("/api/verify", { multipart: { file: { name: "record.pdf", mimeType: "application/pdf", buffer: tampered }, code: record.verificationCode } });
  expect((await bad.json()).matches).toBe(false);
  const unknown = await (await anon.get("/api/verify?code=ZZZZ-ZZZZ-ZZZZ")).json();
  expect(unknown.result.found).toBe(false);
});

test("share links: the page shows only its record; revoked and expired give 410 and leak nothing", async ({ baseURL }) => {
  const api = await apiAs(baseURL!, "supervisor");
  const list = (await (await api.get("/api/inspections?status=approved")).json()).items as { id: number; customerName: string }[];
  const records = await Promise.all(list.map(async (i) => ({ i, r: (await (await api.get(`/api/inspections/${i.id}/record`)).json()).records[0] })));
  const mine = records.find((x) => x.r)!;
  const others = list.filter((i) => i.id !== mine.i.id).map((i) => i.customerName);

  const created = await api.post(`/api/records/${mine.r.id}/share-links`, { data: { audience: "homeowner", expiresInDays: 7 } });
  expect(created.status()).toBe(201);
  const { url } = (await created.json()).shareLink;
  const token = url.split("/share/")[1];
  expect(Buffer.from(token, "base64url").length).toBeGreaterThanOrEqual(16);

  const anon = await playwrightRequest.newContext({ baseURL });
  const page = await anon.get(`/share/${token}`);
  expect(page.status()).toBe(200);
  const html = await page.text();
  expect(html).toContain(mine.r.verificationCode);
  for (const name of others) expect(html).not.toContain(name);
  expect(html).not.toMatch(/<script/i);
  const download = await anon.get(`/share/${token}/pdf`);
  expect(download.status()).toBe(200);
  expect(crypto.createHash("sha256").update(await download.body()).digest("hex")).toBe(mine.r.sha256);

  // Expired: move the expiry into the past directly in the test database.
  const second = (await (await api.post(`/api/records/${mine.r.id}/share-links`, { data: { audience: "inspector", expiresInDays: 1 } })).json()).shareLink;
  const db = new Database(DB_FILE);
  db.prepare("update share_links set expires_at = ? where id = ?").run("2020-01-01T00:00:00.000Z", second.id);
  db.close();
  const expiredToken = second.url.split("/share/")[1];
  const expired = await anon.get(`/share/${expiredToken}`);
  expect(expired.status()).toBe(410);
  const expiredHtml = await expired.text();
  expect(expiredHtml).toMatch(/expired/);
  expect(expiredHtml).not.toContain(mine.r.verificationCode);
  expect((await anon.get(`/share/${expiredToken}/pdf`)).status()).toBe(410);

  // Revoked.
  const links = (await (await api.get(`/api/inspections/${mine.i.id}/record`)).json()).shareLinks as { id: number; state: string }[];
  const active = links.find((l) => l.state === "active")!;
  expect((await api.delete(`/api/share-links/${active.id}`)).status()).toBe(200);
  const revoked = await anon.get(`/share/${token}`);
  expect(revoked.status()).toBe(410);
  expect(await revoked.text()).not.toContain(mine.r.sha256);
  expect((await anon.get("/share/not-a-real-token-at-all-xxxxxxxx")).status()).toBe(404);

  // Installers cannot create share links; another company gets 404.
  const installer = await apiAs(baseURL!, "installer");
  expect((await installer.post(`/api/records/${mine.r.id}/share-links`, { data: { audience: "homeowner", expiresInDays: 7 } })).status()).toBe(403);
  const other = await apiAs(baseURL!, "otherCompanyAdmin");
  expect((await other.post(`/api/records/${mine.r.id}/share-links`, { data: { audience: "homeowner", expiresInDays: 7 } })).status()).toBe(404);
  expect((await other.get(`/api/records/${mine.r.id}/pdf`)).status()).toBe(404);
});

test("e-mail: the homeowner's message arrives at the fake SMTP server with a working link; a double submit sends one; a failure can be retried", async ({ baseURL }) => {
  const api = await apiAs(baseURL!, "supervisor");
  const list = (await (await api.get("/api/inspections?status=approved")).json()).items as { id: number }[];
  let record: { id: number; verificationCode: string } | undefined;
  for (const i of list) {
    record = (await (await api.get(`/api/inspections/${i.id}/record`)).json()).records.find((r: { status: string }) => r.status === "valid");
    if (record) break;
  }
  // Counted by this test's own address: other tests may send mail at the same time.
  const to = `homeowner.${unique("e2e")}@homeowner.test`.toLowerCase();
  const mine = async () => (await outbox(api)).filter((m) => JSON.stringify(m.to).toLowerCase().includes(to));
  const idempotencyKey = unique("e2e-key");
  const body = { to, audience: "homeowner", expiresInDays: 14, attachPdf: true, idempotencyKey };
  const [a, b] = await Promise.all([api.post(`/api/records/${record!.id}/email`, { data: body }), api.post(`/api/records/${record!.id}/email`, { data: body })]);
  expect([a.status(), b.status()].sort()).toEqual([200, 201]);
  await expect.poll(async () => (await mine()).length, { timeout: 10_000 }).toBe(1);
  await new Promise((r) => setTimeout(r, 500));
  const messages = await mine();
  expect(messages.length).toBe(1);
  const message = messages[0]!;
  const text = message.text;
  const link = message.links.find((l) => l.includes("/share/"));
  expect(link, text).toBeTruthy();
  expect(text).toContain(record!.verificationCode);
  expect(message.attachments.map((a) => a.filename).join(" ")).toMatch(/\.pdf$/);
  const anon = await playwrightRequest.newContext({ baseURL });
  expect((await anon.get(new URL(link!).pathname)).status()).toBe(200);

  // The fake server refuses the next message to this address: the send is failed, visible, and retried once.
  fs.mkdirSync(OUTBOX, { recursive: true });
  fs.writeFileSync(path.join(OUTBOX, ".fail-next"), to);
  const failed = await api.post(`/api/records/${record!.id}/email`, { data: { ...body, idempotencyKey: `${idempotencyKey}-f`, attachPdf: false } });
  const failedSend = (await failed.json()).emailSend;
  expect(failedSend.status).toBe("failed");
  const retried = await api.post(`/api/email-sends/${failedSend.id}/retry`);
  expect((await retried.json()).emailSend.status).toBe("sent");
});

test("a corrected revision supersedes the record; verification says so", async ({ page, baseURL }) => {
  const api = await apiAs(baseURL!, "supervisor");
  const list = (await (await api.get("/api/inspections?status=approved")).json()).items as { id: number }[];
  const target = list[0]!;
  const oldRecord = (await (await api.get(`/api/inspections/${target.id}/record`)).json()).records[0];
  const { id: revisionId } = await (await api.post(`/api/inspections/${target.id}/revise`)).json();
  const revision = (await (await api.get(`/api/inspections/${revisionId}`)).json()).inspection;
  const submit = await api.post(`/api/inspections/${revisionId}/submit`, { data: { version: revision.version, signature: { typedName: DEMO_ACCOUNTS.supervisor.name, signaturePng: await signaturePng() } } });
  expect(submit.status(), await submit.text()).toBe(200);
  const approve = await api.post(`/api/inspections/${revisionId}/approve`, { data: { signature: { typedName: DEMO_ACCOUNTS.supervisor.name, signaturePng: await signaturePng() }, password: DEMO_ACCOUNTS.supervisor.password } });
  expect(approve.status(), await approve.text()).toBe(200);

  const anon = await playwrightRequest.newContext({ baseURL });
  const result = (await (await anon.get(`/api/verify?code=${encodeURIComponent(oldRecord.verificationCode)}`)).json()).result;
  expect(result.status).toBe("superseded");
  expect(result.supersededByRevision).toBe(oldRecord.revision + 1);
  // The old revision's PDF is still served, unchanged.
  const oldPdf = await api.get(`/api/records/${oldRecord.id}/pdf`);
  expect(crypto.createHash("sha256").update(await oldPdf.body()).digest("hex")).toBe(oldRecord.sha256);

  await page.goto(`/verify?code=${encodeURIComponent(oldRecord.verificationCode)}`);
  await expect(page.getByTestId("verify-result")).toHaveAttribute("data-status", "superseded");
  await expect(page.getByText(`superseded by revision ${oldRecord.revision + 1}`)).toBeVisible();
});

test("supervisor's screen: e-mail from the inspection page, read it in the outbox, open the link, verify on /verify", async ({ page, browser, baseURL }) => {
  await new SignInPage(page).signInAs("supervisor");
  const api = await apiAs(baseURL!, "supervisor");
  const list = (await (await api.get("/api/inspections?status=approved")).json()).items as { id: number }[];
  await page.goto(`/inspections/${list[0]!.id}`);
  const panel = page.getByTestId("record-panel");
  await expect(panel).toBeVisible();
  await panel.getByLabel("To").fill("wren.homeowner@homeowner.test");
  await panel.getByRole("button", { name: "Send" }).click();
  await expect(panel.getByText("Sent to wren.homeowner@homeowner.test.")).toBeVisible({ timeout: 15_000 });

  await page.goto("/dev/outbox");
  await page.getByText(/wren\.homeowner@homeowner\.test/).first().click();
  const shareHref = await page.locator('a[href*="/share/"]').first().getAttribute("href");
  expect(shareHref).toBeTruthy();

  const homeowner = await (await browser.newContext({ baseURL })).newPage();
  await homeowner.goto(new URL(shareHref!, baseURL).pathname);
  await expect(homeowner.getByText("Current record")).toBeVisible();
  const code = (await homeowner.getByTestId("share-code").textContent())!.trim();
  const [download] = await Promise.all([homeowner.waitForEvent("download"), homeowner.getByRole("link", { name: "Download the PDF record" }).click()]);
  const file = await download.path();
  await homeowner.getByRole("link", { name: "Check it is genuine" }).click();
  await expect(homeowner.getByTestId("verify-result")).toHaveAttribute("data-status", "valid");
  await expect(homeowner.locator("#code")).toHaveValue(code);
  await homeowner.getByLabel("Record PDF").setInputFiles(file!);
  await homeowner.getByRole("button", { name: "Check the file" }).click();
  await expect(homeowner.getByTestId("upload-result")).toHaveAttribute("data-matches", "true");
});
