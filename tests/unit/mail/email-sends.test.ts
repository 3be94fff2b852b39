import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { Knex } from "knex";
import { afterAll, beforeAll, beforeEach, describe, expect, test } from "vitest";
import { createTestDatabase } from "../../fixtures/test-db";
import { buildMailWorld } from "../../fixtures/mail-world";
import { startFakeSmtp, type FakeSmtp } from "../../../scripts/fake-smtp";
import { FAIL_NEXT_FLAG, type StoredOutboxMessage } from "@/lib/mail/outbox-format";
import { AppError } from "@/lib/errors";
import { setStorage } from "@/lib/storage";
import { createMemoryStorage, type MemoryStorage } from "@/lib/storage/memory";

type EmailSends = typeof import("@/lib/data/email-sends");

let db: Knex;
let cleanup: () => Promise<void>;
let sends: EmailSends;
let world: Awaited<ReturnType<typeof buildMailWorld>>;
let smtp: FakeSmtp;
let outboxDir: string;
let storage: MemoryStorage;
const savedEnv = { ...process.env };

beforeAll(async () => {
  const t = await createTestDatabase();
  db = t.db;
  cleanup = t.cleanup;
  process.env.FLUEWARD_DB_FILE = t.file;
  outboxDir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-outbox-"));
  smtp = await startFakeSmtp({ port: 0, outboxDir });
  delete process.env.SMTP_HOST;
  process.env.FAKE_SMTP_PORT = String(smtp.port);
  storage = createMemoryStorage();
  setStorage(storage);
  sends = await import("@/lib/data/email-sends");
  world = await buildMailWorld(db);
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
  await smtp.close();
  setStorage(null);
  fs.rmSync(outboxDir, { recursive: true, force: true });
  process.env = savedEnv;
});

beforeEach(() => {
  for (const name of fs.readdirSync(outboxDir)) fs.rmSync(path.join(outboxDir, name), { force: true });
});

function outbox(): StoredOutboxMessage[] {
  return fs
    .readdirSync(outboxDir)
    .filter((name) => name.endsWith(".json"))
    .sort()
    .map((name) => JSON.parse(fs.readFileSync(path.join(outboxDir, name), "utf8")) as StoredOutboxMessage);
}

function failNext() {
  fs.writeFileSync(path.join(outboxDir, FAIL_NEXT_FLAG), "");
}

const key = () => crypto.randomUUID();
const pdf = new Uint8Array(Buffer.from("%PDF-1.7\n% invented record bytes\n%%EOF\n"));
const pdfSha = crypto.createHash("sha256").update(pdf).digest("hex");

function request(company: (typeof world)["a"], idempotencyKey: string, overrides: { to?: string; recordId?: number; shareLinkId?: number | null } = {}) {
  return {
    companyId: company.companyId,
    actor: { userId: company.supervisor.userId, name: company.supervisor.name },
    recordId: overrides.recordId ?? company.recordId,
    shareLinkId: overrides.shareLinkId === undefined ? company.shareLinkId : overrides.shareLinkId,
    to: overrides.to ?? "homeowner@example.test",
    idempotencyKey,
    message: {
      subject: "Your inspection record from Test Heating — 1 Test Lane",
      text: "Open the record:\nhttp://localhost:3000/share/test-token\n",
      html: '<p><a href="http://localhost:3000/share/test-token">Open the record</a></p>',
    },
    attachment: { filename: "flueward-record-R-000001-rev1.pdf", contentType: "application/pdf", content: pdf },
  };
}

async function appErrorOf(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

async function auditActions(companyId: number, recordId: number): Promise<string[]> {
  const rows = await db("audit_events").where({ company_id: companyId, entity_type: "record", entity_id: recordId }).orderBy("id");
  return rows.map((r) => r.action as string);
}

describe("sending a record by e-mail", () => {
  test("the e-mail arrives with its attachment and the row says sent", async () => {
    const result = await sends.sendRecordEmail(request(world.a, key()));
    expect(result.duplicate).toBe(false);
    expect(result.emailSend).toMatchObject({ status: "sent", attempts: 1, lastError: null, toAddress: "homeowner@example.test", attachPdf: true, recordId: world.a.recordId });
    const [message, ...rest] = outbox();
    expect(rest).toEqual([]);
    expect(message!.to).toEqual(["homeowner@example.test"]);
    expect(message!.text).toContain("http://localhost:3000/share/test-token");
    expect(message!.attachments[0]!.sha256).toBe(pdfSha);
    expect(result.emailSend.messageId).toBe(message!.messageId);
    // A sent message is not kept for retries.
    expect(storage.keys().filter((k) => k.startsWith("mail-pending/"))).toEqual([]);
  });

  test("pressing Send twice with the same key sends one e-mail", async () => {
    const k = key();
    const first = await sends.sendRecordEmail(request(world.a, k));
    const second = await sends.sendRecordEmail(request(world.a, k));
    expect(second.duplicate).toBe(true);
    expect(second.emailSend.id).toBe(first.emailSend.id);
    expect(second.emailSend.status).toBe("sent");
    expect(outbox()).toHaveLength(1);
  });

  test("two presses at the same moment send one e-mail", async () => {
    const k = key();
    const results = await Promise.all([sends.sendRecordEmail(request(world.a, k)), sends.sendRecordEmail(request(world.a, k)), sends.sendRecordEmail(request(world.a, k))]);
    expect(new Set(results.map((r) => r.emailSend.id)).size).toBe(1);
    expect(results.filter((r) => !r.duplicate)).toHaveLength(1);
    // The later presses may see the first one still sending: they return it and send nothing.
    for (const r of results.filter((x) => x.duplicate)) expect(["sending", "sent"]).toContain(r.emailSend.status);
    expect(outbox()).toHaveLength(1);
    expect((await db("email_sends").where({ company_id: world.a.companyId, idempotency_key: k })).length).toBe(1);
  });

  test("a key used for a different recipient is refused, not sent", async () => {
    const k = key();
    await sends.sendRecordEmail(request(world.a, k));
    const error = await appErrorOf(sends.sendRecordEmail(request(world.a, k, { to: "someone-else@example.test" })));
    expect(error.code).toBe("unprocessable");
    expect(outbox()).toHaveLength(1);
  });

  test("keys are per company: the same key in another company is its own e-mail", async () => {
    const k = key();
    const a = await sends.sendRecordEmail(request(world.a, k));
    const b = await sends.sendRecordEmail(request(world.b, k));
    expect(b.duplicate).toBe(false);
    expect(b.emailSend.id).not.toBe(a.emailSend.id);
    expect(outbox()).toHaveLength(2);
  });

  test("a failed send is recorded with a short error and an audit event, and a retry sends it once", async () => {
    failNext();
    const { emailSend: failed } = await sends.sendRecordEmail(request(world.a, key()));
    expect(failed.status).toBe("failed");
    expect(failed.attempts).toBe(1);
    expect(failed.lastError).toMatch(/451/);
    expect(failed.lastError!.length).toBeLessThanOrEqual(300);
    expect(outbox()).toHaveLength(0);
    expect((await auditActions(world.a.companyId, world.a.recordId)).at(-1)).toBe("record.email_failed");

    const retried = await sends.retryEmailSend({ companyId: world.a.companyId, actor: { userId: world.a.supervisor.userId, name: world.a.supervisor.name }, emailSendId: failed.id });
    expect(retried).toMatchObject({ id: failed.id, status: "sent", attempts: 2, lastError: null });
    const messages = outbox();
    expect(messages).toHaveLength(1);
    expect(messages[0]!.subject).toBe("Your inspection record from Test Heating — 1 Test Lane");
    expect(messages[0]!.attachments[0]!.sha256).toBe(pdfSha);
    expect((await auditActions(world.a.companyId, world.a.recordId)).at(-1)).toBe("record.emailed");

    const again = await appErrorOf(sends.retryEmailSend({ companyId: world.a.companyId, actor: { userId: null, name: "x" }, emailSendId: failed.id }));
    expect(again.code).toBe("unprocessable");
    expect(outbox()).toHaveLength(1);
  });

  test("two retries at once send once", async () => {
    failNext();
    const { emailSend: failed } = await sends.sendRecordEmail(request(world.a, key()));
    expect(failed.status).toBe("failed");
    const actor = { userId: world.a.supervisor.userId, name: world.a.supervisor.name };
    const outcomes = await Promise.allSettled([
      sends.retryEmailSend({ companyId: world.a.companyId, actor, emailSendId: failed.id }),
      sends.retryEmailSend({ companyId: world.a.companyId, actor, emailSendId: failed.id }),
    ]);
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
    const rejected = outcomes.find((o) => o.status === "rejected") as PromiseRejectedResult;
    expect((rejected.reason as AppError).code).toBe("unprocessable");
    expect(outbox()).toHaveLength(1);
  });

  test("another company can neither retry nor list nor send for a company's record", async () => {
    failNext();
    const { emailSend: failed } = await sends.sendRecordEmail(request(world.a, key()));
    const actorB = { userId: world.b.supervisor.userId, name: world.b.supervisor.name };
    expect((await appErrorOf(sends.retryEmailSend({ companyId: world.b.companyId, actor: actorB, emailSendId: failed.id }))).code).toBe("not_found");
    expect((await appErrorOf(sends.getEmailSend({ companyId: world.b.companyId, id: failed.id }))).code).toBe("not_found");
    expect(await sends.listEmailSends({ companyId: world.b.companyId, recordId: world.a.recordId })).toEqual([]);
    expect((await appErrorOf(sends.sendRecordEmail(request(world.b, key(), { recordId: world.a.recordId, shareLinkId: null })))).code).toBe("not_found");
    // Nor can a company point its e-mail at another company's share link.
    expect((await appErrorOf(sends.sendRecordEmail(request(world.b, key(), { shareLinkId: world.a.shareLinkId })))).code).toBe("not_found");
    expect(outbox()).toHaveLength(0);
    const row = await sends.getEmailSend({ companyId: world.a.companyId, id: failed.id });
    expect(row.status).toBe("failed");
  });

  test("a failed e-mail whose share link has expired is not resent", async () => {
    failNext();
    const { emailSend: failed } = await sends.sendRecordEmail(request(world.a, key(), { shareLinkId: world.a.expiredShareLinkId }));
    const error = await appErrorOf(sends.retryEmailSend({ companyId: world.a.companyId, actor: { userId: null, name: "x" }, emailSendId: failed.id }));
    expect(error.code).toBe("unprocessable");
    expect(error.message).toMatch(/expired or was revoked/);
    expect(outbox()).toHaveLength(0);
  });

  test("a retry may carry a newly composed message", async () => {
    failNext();
    const { emailSend: failed } = await sends.sendRecordEmail(request(world.a, key()));
    const retried = await sends.retryEmailSend({
      companyId: world.a.companyId,
      actor: { userId: null, name: "x" },
      emailSendId: failed.id,
      message: { subject: "Recomposed", text: "new text", html: "<p>new text</p>" },
      attachment: null,
    });
    expect(retried).toMatchObject({ status: "sent", subject: "Recomposed", attachPdf: false });
    expect(outbox().map((m) => [m.subject, m.attachments.length])).toEqual([["Recomposed", 0]]);
  });

  test("a row left 'sending' by a crash can be retried only once it is stale", async () => {
    const { emailSend } = await sends.sendRecordEmail(request(world.a, key()));
    await db("email_sends").where({ id: emailSend.id }).update({ status: "sending", updated_at: new Date().toISOString() });
    expect((await appErrorOf(sends.retryEmailSend({ companyId: world.a.companyId, actor: { userId: null, name: "x" }, emailSendId: emailSend.id }))).message).toMatch(/being sent/);
    // The sent message was not kept, so a stale one cannot be resent blindly either.
    await db("email_sends").where({ id: emailSend.id }).update({ updated_at: new Date(Date.now() - sends.STALE_SENDING_MS - 1000).toISOString() });
    expect((await appErrorOf(sends.retryEmailSend({ companyId: world.a.companyId, actor: { userId: null, name: "x" }, emailSendId: emailSend.id }))).message).toMatch(/can no longer be resent/);
    expect((await sends.getEmailSend({ companyId: world.a.companyId, id: emailSend.id })).status).toBe("failed");
  });

  test("bad input is a validation error and writes nothing", async () => {
    const before = await db("email_sends").count<{ n: number }[]>({ n: "id" }).first();
    const error = await appErrorOf(sends.sendRecordEmail(request(world.a, "short", { to: "not an address" })));
    expect(error.code).toBe("validation_failed");
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(["idempotencyKey", "to"]);
    const after = await db("email_sends").count<{ n: number }[]>({ n: "id" }).first();
    expect(after?.n).toBe(before?.n);
  });

  test("a record's e-mails are listed newest first", async () => {
    const list = await sends.listEmailSends({ companyId: world.a.companyId, recordId: world.a.recordId });
    expect(list.length).toBeGreaterThan(3);
    expect(list.map((s) => s.id)).toEqual([...list.map((s) => s.id)].sort((x, y) => y - x));
    expect(list.every((s) => s.recordId === world.a.recordId)).toBe(true);
  });
});
