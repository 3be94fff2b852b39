import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { NextRequest } from "next/server";
import { afterAll, beforeAll, beforeEach, describe, expect, test, vi } from "vitest";
import type { Member } from "@/lib/auth/session";
import { newOutboxId, type StoredOutboxMessage } from "@/lib/mail/outbox-format";

// The session is the one thing faked here: each test says who is asking.
const auth = vi.hoisted(() => ({ member: null as Member | null }));
vi.mock("@/lib/auth/session", async () => {
  const { AppError } = await import("@/lib/errors");
  return {
    requireMember: async () => {
      if (!auth.member) throw new AppError("unauthenticated");
      return auth.member;
    },
  };
});

const env = process.env as Record<string, string | undefined>;
const saved = { NODE_ENV: env.NODE_ENV, FLUEWARD_DEV_OUTBOX: env.FLUEWARD_DEV_OUTBOX, FLUEWARD_OUTBOX_DIR: env.FLUEWARD_OUTBOX_DIR };
let dir: string;
const member: Member = { sessionIdHash: "x", userId: 1, companyId: 1, companyName: "Demo", role: "installer", name: "Ada", email: "ada@example.test", mustChangePassword: false };

function store(to: string, subject: string, at: Date) {
  const message: StoredOutboxMessage = {
    id: newOutboxId(at),
    from: "Flueward records <records@flueward.test>",
    to: [to],
    subject,
    text: `Open it: http://localhost:3100/share/${subject}`,
    html: "",
    attachments: [],
    messageId: `<${subject}@flueward.test>`,
    receivedAt: at.toISOString(),
  };
  fs.writeFileSync(path.join(dir, `${message.id}.json`), JSON.stringify(message));
}

async function get(query = "") {
  const { GET } = await import("@/app/api/dev/outbox/route");
  return GET(new NextRequest(`http://localhost/api/dev/outbox${query}`), { params: Promise.resolve({}) });
}

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-outbox-"));
  env.FLUEWARD_OUTBOX_DIR = dir;
  store("one@example.test", "first", new Date("2026-12-01T10:00:00Z"));
  store("two@example.test", "second", new Date("2026-12-01T10:05:00Z"));
  store("one@example.test", "third", new Date("2026-12-01T10:10:00Z"));
  fs.writeFileSync(path.join(dir, ".tmp-partial.json"), "{");
});

beforeEach(() => {
  auth.member = member;
  env.NODE_ENV = "test";
  delete env.FLUEWARD_DEV_OUTBOX;
});

afterAll(() => {
  Object.assign(env, saved);
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("GET /api/dev/outbox", () => {
  test("lists the messages newest first with their links", async () => {
    const response = await get();
    expect(response.status).toBe(200);
    const body = (await response.json()) as { messages: { subject: string; links: string[] }[] };
    expect(body.messages.map((m) => m.subject)).toEqual(["third", "second", "first"]);
    expect(body.messages[0]!.links).toEqual(["http://localhost:3100/share/third"]);
  });

  test("filters by recipient and limits", async () => {
    const body = (await (await get("?to=ONE@example.test&limit=1")).json()) as { messages: { subject: string }[] };
    expect(body.messages.map((m) => m.subject)).toEqual(["third"]);
    expect((await get("?limit=0")).status).toBe(400);
  });

  test("needs a signed-in member", async () => {
    auth.member = null;
    expect((await get()).status).toBe(401);
  });

  test("is not there in production unless FLUEWARD_DEV_OUTBOX=1", async () => {
    env.NODE_ENV = "production";
    auth.member = null;
    expect((await get()).status).toBe(404);
    env.FLUEWARD_DEV_OUTBOX = "1";
    auth.member = member;
    expect((await get()).status).toBe(200);
  });
});
