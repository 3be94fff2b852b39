import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { startFakeSmtp, type FakeSmtp } from "../../../scripts/fake-smtp";
import { FAIL_NEXT_FLAG } from "@/lib/mail/outbox-format";
import { MailConfigError, deliverMail, describeSendError, mailConfigFromEnv } from "@/lib/mail/transport";
import { extractLinks, getOutboxMessage, listOutbox, outboxEnabled } from "@/lib/mail/outbox";

let smtp: FakeSmtp;
let outboxDir: string;
const saved = { ...process.env };

beforeAll(async () => {
  outboxDir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-outbox-"));
  smtp = await startFakeSmtp({ port: 0, outboxDir });
  delete process.env.SMTP_HOST;
  process.env.FAKE_SMTP_PORT = String(smtp.port);
  process.env.FLUEWARD_OUTBOX_DIR = outboxDir;
});

afterAll(async () => {
  await smtp.close();
  fs.rmSync(outboxDir, { recursive: true, force: true });
  process.env = saved;
});

const pdfBytes = new Uint8Array(Buffer.from("%PDF-1.7\n% invented test bytes\n%%EOF\n"));
const shareUrl = "http://localhost:3000/share/abcDEF123_-token";

async function expectRejection(promise: Promise<unknown>): Promise<unknown> {
  return promise.then(
    () => {
      throw new Error("expected the send to fail");
    },
    (error: unknown) => error,
  );
}

describe("the fake SMTP server and the transport", () => {
  test("a message sent through the transport arrives in the outbox with its subject, link and attachment", async () => {
    const { messageId } = await deliverMail({
      to: "homeowner@example.test",
      subject: "Your inspection record from Maple Hollow Heating — 12 Birchfield Way",
      text: `Open the record:\n${shareUrl}\n`,
      html: `<p><a href="${shareUrl}">Open the record</a></p>`,
      attachments: [{ filename: "flueward-record-R-000001-rev1.pdf", contentType: "application/pdf", content: pdfBytes }],
    });
    expect(messageId).toMatch(/@/);

    const list = await listOutbox({ limit: 10 });
    expect(list).toHaveLength(1);
    const summary = list[0]!;
    expect(summary.to).toEqual(["homeowner@example.test"]);
    expect(summary.attachmentCount).toBe(1);

    const message = await getOutboxMessage(summary.id);
    expect(message).not.toBeNull();
    expect(message!.subject).toBe("Your inspection record from Maple Hollow Heating — 12 Birchfield Way");
    expect(message!.from).toContain("records@flueward.test");
    expect(message!.links).toEqual([shareUrl]);
    expect(message!.messageId).toBe(messageId);
    expect(message!.attachments).toEqual([
      {
        filename: "flueward-record-R-000001-rev1.pdf",
        contentType: "application/pdf",
        size: pdfBytes.length,
        sha256: crypto.createHash("sha256").update(pdfBytes).digest("hex"),
      },
    ]);
    // Written atomically: no temporary files are left behind.
    expect(fs.readdirSync(outboxDir).filter((name) => name.startsWith(".tmp-"))).toEqual([]);
  });

  test("the fail flag refuses the next message with a temporary 451, once", async () => {
    fs.writeFileSync(path.join(outboxDir, FAIL_NEXT_FLAG), "");
    const before = (await listOutbox()).length;
    const error = await expectRejection(deliverMail({ to: "a@example.test", subject: "Refused", text: "x", html: "<p>x</p>" }));
    expect((error as { responseCode?: number }).responseCode).toBe(451);
    expect(describeSendError(error)).toMatch(/could not take the message right now/);
    expect(describeSendError(error)).toMatch(/451/);
    expect(fs.existsSync(path.join(outboxDir, FAIL_NEXT_FLAG))).toBe(false);
    expect(await listOutbox()).toHaveLength(before);

    await deliverMail({ to: "a@example.test", subject: "Accepted", text: "x", html: "<p>x</p>" });
    const newest = (await listOutbox())[0]!;
    expect(newest.subject).toBe("Accepted");
  });

  test("a fail flag naming an address refuses only the next message to that address", async () => {
    fs.writeFileSync(path.join(outboxDir, FAIL_NEXT_FLAG), "Target@Example.test\n");
    const before = (await listOutbox()).length;
    await deliverMail({ to: "bystander@example.test", subject: "Someone else's", text: "x", html: "" });
    expect(await listOutbox()).toHaveLength(before + 1);
    expect(fs.existsSync(path.join(outboxDir, FAIL_NEXT_FLAG))).toBe(true);
    const error = await expectRejection(deliverMail({ to: "target@example.test", subject: "Refused", text: "x", html: "" }));
    expect((error as { responseCode?: number }).responseCode).toBe(451);
    expect(fs.existsSync(path.join(outboxDir, FAIL_NEXT_FLAG))).toBe(false);
    await deliverMail({ to: "target@example.test", subject: "Accepted", text: "x", html: "" });
    expect(await listOutbox()).toHaveLength(before + 2);
  });

  test("failFirst (FAKE_SMTP_FAIL=1) refuses only the first message", async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-outbox-"));
    const failing = await startFakeSmtp({ port: 0, outboxDir: dir, failFirst: true });
    const port = process.env.FAKE_SMTP_PORT;
    process.env.FAKE_SMTP_PORT = String(failing.port);
    try {
      const error = await expectRejection(deliverMail({ to: "b@example.test", subject: "First", text: "x", html: "" }));
      expect((error as { responseCode?: number }).responseCode).toBe(451);
      await deliverMail({ to: "b@example.test", subject: "Second", text: "x", html: "" });
      expect(fs.readdirSync(dir).filter((name) => name.endsWith(".json"))).toHaveLength(1);
    } finally {
      process.env.FAKE_SMTP_PORT = port;
      await failing.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  test("an unreachable server gives a short error without details", async () => {
    const port = process.env.FAKE_SMTP_PORT;
    const closed = await startFakeSmtp({ port: 0, outboxDir });
    await closed.close();
    process.env.FAKE_SMTP_PORT = String(closed.port);
    try {
      const error = await expectRejection(deliverMail({ to: "c@example.test", subject: "Nobody home", text: "x", html: "" }));
      expect(describeSendError(error)).toBe("Could not reach the mail server. Try again in a few minutes.");
    } finally {
      process.env.FAKE_SMTP_PORT = port;
    }
  });

  test("outbox ids are checked: a path is never read", async () => {
    expect(await getOutboxMessage("../../etc/passwd")).toBeNull();
    expect(await getOutboxMessage("20261201T000000000Z-00000000")).toBeNull();
  });
});

describe("mail settings", () => {
  test("without SMTP_HOST, development uses the local fake and production refuses", () => {
    expect(mailConfigFromEnv({ NODE_ENV: "development" })).toMatchObject({ host: "127.0.0.1", port: 2525, fake: true, secure: false });
    expect(mailConfigFromEnv({ NODE_ENV: "test", FAKE_SMTP_PORT: "2626" }).port).toBe(2626);
    expect(() => mailConfigFromEnv({ NODE_ENV: "production" })).toThrow(MailConfigError);
    expect(describeSendError(new MailConfigError("E-mail is not set up"))).toBe("E-mail is not set up");
  });

  test("SMTP_* variables configure a real server; TLS is required off loopback", () => {
    const config = mailConfigFromEnv({ NODE_ENV: "production", SMTP_HOST: "smtp.example.test", SMTP_USER: "u", SMTP_PASSWORD: "p", MAIL_FROM: "Office <office@example.test>" });
    expect(config).toMatchObject({ host: "smtp.example.test", port: 587, secure: false, requireTls: true, user: "u", password: "p", from: "Office <office@example.test>", fake: false });
    expect(mailConfigFromEnv({ SMTP_HOST: "smtp.example.test", SMTP_PORT: "465", SMTP_SECURE: "true" })).toMatchObject({ port: 465, secure: true, requireTls: false });
    expect(mailConfigFromEnv({ SMTP_HOST: "127.0.0.1", SMTP_PORT: "2525" })).toMatchObject({ requireTls: false, from: "Flueward records <records@flueward.test>" });
    expect(() => mailConfigFromEnv({ SMTP_HOST: "smtp.example.test", SMTP_PORT: "nope" })).toThrow(MailConfigError);
  });

  test("an EAUTH error never echoes the server's reply", () => {
    expect(describeSendError(Object.assign(new Error("Invalid login: 535 secret"), { code: "EAUTH", responseCode: 535, response: "535 password=hunter2" }))).not.toMatch(/hunter2/);
  });

  test("the outbox is on outside production, and in production only with FLUEWARD_DEV_OUTBOX=1", () => {
    expect(outboxEnabled({ NODE_ENV: "development" })).toBe(true);
    expect(outboxEnabled({ NODE_ENV: "test" })).toBe(true);
    expect(outboxEnabled({ NODE_ENV: "production" })).toBe(false);
    expect(outboxEnabled({ NODE_ENV: "production", FLUEWARD_DEV_OUTBOX: "1" })).toBe(true);
  });

  test("links are taken from hrefs and bare URLs, once each", () => {
    expect(extractLinks("See https://a.test/x. And https://b.test/y", '<a href="https://a.test/x">x</a> <a href="mailto:z@a.test">m</a>')).toEqual(["https://a.test/x", "https://b.test/y"]);
  });
});
