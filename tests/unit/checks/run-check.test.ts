import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createTestDatabase } from "../../fixtures/test-db";
import { buildInspectionWorld } from "../../fixtures/inspection-world";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { evaluateInspection, prepareRulebook } from "@/lib/venting";
import { AppError } from "@/lib/errors";

/**
 * POST /api/check's core (lib/checks/run-check.ts): it names the version it checked against from
 * a content-less read and prepares each version once; the answer must be the engine's own for
 * that version's content, and only ever the caller's company's version.
 */
type RunCheck = typeof import("@/lib/checks/run-check");
type Rulebooks = typeof import("@/lib/data/rulebooks");

let db: Knex;
let cleanup: () => Promise<void>;
let checks: RunCheck;
let rulebooks: Rulebooks;
let world: Awaited<ReturnType<typeof buildInspectionWorld>>;

const example = JSON.parse(fs.readFileSync(path.join(process.cwd(), "docs/examples/check-request.json"), "utf8")) as Record<string, unknown>;
const { rulebookVersionId: _pinned, ...input } = example;

beforeAll(async () => {
  const t = await createTestDatabase();
  db = t.db;
  cleanup = t.cleanup;
  process.env.FLUEWARD_DB_FILE = t.file;
  checks = await import("@/lib/checks/run-check");
  rulebooks = await import("@/lib/data/rulebooks");
  world = await buildInspectionWorld(db);
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

async function expectAppError(promise: Promise<unknown>, code: string) {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  expect((error as AppError).code).toBe(code);
}

describe("the checker", () => {
  test("without a version it checks against the current one, and answers what the engine answers for its content", async () => {
    const request = checks.checkRequestSchema.parse(input);
    const answer = await checks.runCheck({ companyId: world.a.companyId, request });
    const current = (await rulebooks.getCurrentRulebookVersion({ companyId: world.a.companyId }))!;
    expect(answer.rulebook).toEqual({ rulebookId: current.rulebookId, name: current.rulebookName, versionId: current.id, versionNumber: current.versionNumber, contentSha256: current.contentSha256 });
    expect(answer.rulebook.versionId).toBe(world.a.rulebookVersionId);
    const engine = evaluateInspection(checks.checkRequestSchema.parse(input), prepareRulebook(STARTER_RULEBOOK));
    expect(answer.summary).toEqual(engine.summary);
    expect(answer.findings).toEqual(engine.findings.map((f) => ({ ...f, rulebookVersion: "Starter, version 1" })));
    expect(answer.findings.length).toBeGreaterThan(10);
  });

  test("a pinned version of the company's is used; another company's version is not found", async () => {
    const own = await checks.runCheck({ companyId: world.a.companyId, request: checks.checkRequestSchema.parse({ ...input, rulebookVersionId: world.a.rulebookVersionId }) });
    expect(own.rulebook.versionId).toBe(world.a.rulebookVersionId);
    await expectAppError(checks.runCheck({ companyId: world.a.companyId, request: checks.checkRequestSchema.parse({ ...input, rulebookVersionId: world.b.rulebookVersionId }) }), "not_found");
    await expectAppError(rulebooks.getRulebookVersionContent({ companyId: world.a.companyId, versionId: world.b.rulebookVersionId }), "not_found");
  });

  test("a newer version becomes current and is prepared from its own content", async () => {
    const json = JSON.stringify(STARTER_RULEBOOK);
    const rulebookId = (await db("rulebook_versions").where({ id: world.b.rulebookVersionId }).first("rulebook_id")).rulebook_id as number;
    const [row] = await db("rulebook_versions")
      .insert({ company_id: world.b.companyId, rulebook_id: rulebookId, version_number: 2, change_note: "second", content_json: json, content_sha256: crypto.createHash("sha256").update(json).digest("hex"), created_at: new Date().toISOString() })
      .returning("id");
    const v2 = typeof row === "object" ? (row as { id: number }).id : (row as number);
    await db("rulebooks").where({ id: rulebookId }).update({ latest_version_number: 2 });
    const ref = await rulebooks.getRulebookVersionRef({ companyId: world.b.companyId });
    expect(ref).toMatchObject({ id: v2, versionNumber: 2, rulebookId });
    const answer = await checks.runCheck({ companyId: world.b.companyId, request: checks.checkRequestSchema.parse(input) });
    expect(answer.rulebook.versionId).toBe(v2);
    expect(answer.findings.every((f) => f.rulebookVersion === "Starter, version 2")).toBe(true);
  });

  test("a company without a default rulebook has no current version, and the check says what to do", async () => {
    await db("companies").where({ id: world.a.companyId }).update({ default_rulebook_id: null });
    try {
      expect(await rulebooks.getRulebookVersionRef({ companyId: world.a.companyId })).toBeNull();
      await expectAppError(checks.runCheck({ companyId: world.a.companyId, request: checks.checkRequestSchema.parse(input) }), "unprocessable");
    } finally {
      const rulebookId = (await db("rulebook_versions").where({ id: world.a.rulebookVersionId }).first("rulebook_id")).rulebook_id as number;
      await db("companies").where({ id: world.a.companyId }).update({ default_rulebook_id: rulebookId });
    }
  });
});
