import path from "node:path";
import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createTestDatabase } from "../../fixtures/test-db";
import { buildInspectionWorld, exampleInspectionData } from "../../fixtures/inspection-world";
import { inspectionDataSchema } from "@/lib/inspections/data";
import { evaluateInspectionData, findingKey, submissionBlockers } from "@/lib/inspections/evaluate";
import { prepareRulebook } from "@/lib/venting";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { AppError } from "@/lib/errors";

type Inspections = typeof import("@/lib/data/inspections");
type SiteChecks = typeof import("@/lib/data/site-checks");

let db: Knex;
let cleanup: () => Promise<void>;
let inspections: Inspections;
let siteChecks: SiteChecks;
let world: Awaited<ReturnType<typeof buildInspectionWorld>>;

const SIGNATURE = "data:image/png;base64,iVBORw0KGgo=";

beforeAll(async () => {
  const t = await createTestDatabase();
  db = t.db;
  cleanup = t.cleanup;
  process.env.FLUEWARD_DB_FILE = t.file;
  process.env.FLUEWARD_UPLOADS_DIR = path.join(path.dirname(t.file), "uploads");
  inspections = await import("@/lib/data/inspections");
  siteChecks = await import("@/lib/data/site-checks");
  world = await buildInspectionWorld(db);
});

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
});

async function expectAppError(promise: Promise<unknown>, code: string) {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(AppError);
  expect((error as AppError).code).toBe(code);
}

describe("inspection workflow", () => {
  test("the server's stored findings equal what the editor computes in the browser for the same input", async () => {
    const { id } = await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId });
    const data = inspectionDataSchema.parse(exampleInspectionData());
    const saved = await inspections.saveDraft({ member: world.a.installer, id, version: 1, data });
    const stored = await inspections.getInspection({ companyId: world.a.companyId, id });

    // The browser gets the rulebook as JSON and the site-check list from the API, then runs the same function.
    const contentAsSent = JSON.parse(JSON.stringify(STARTER_RULEBOOK));
    const items = JSON.parse(JSON.stringify(await siteChecks.listSiteCheckItems({ companyId: world.a.companyId })));
    const local = evaluateInspectionData(JSON.parse(JSON.stringify(data)), prepareRulebook(contentAsSent), items);

    expect(stored.findings).toEqual(JSON.parse(JSON.stringify(local.findings)));
    expect(saved.summary).toEqual(local.summary);
    expect(local.findings.length).toBeGreaterThan(20);
    expect(local.findings.some((f) => f.code === "connector.slope" && f.status === "fail")).toBe(true);
  });

  test("the API's JSON text is getInspection's answer, with findings as stored; damaged stored findings still give valid JSON", async () => {
    const { id } = await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId });
    const data = inspectionDataSchema.parse(exampleInspectionData());
    const saved = await inspections.saveDraft({ member: world.a.installer, id, version: 1, data });
    const justified = { ...data, justifications: Object.fromEntries(submissionBlockers(saved.findings, {}).map((f) => [findingKey(f), { text: "Allowed by the manual.", reference: "p. 3" }])) };
    const again = await inspections.saveDraft({ member: world.a.installer, id, version: saved.version, data: justified });
    await inspections.submitInspection({ member: world.a.installer, id, version: again.version, typedName: "I One", signaturePng: SIGNATURE });
    await inspections.returnInspection({ member: world.a.supervisor, id, comments: [{ section: "ventRun", body: "Add a hanger at the elbow." }] });

    const detail = await inspections.getInspection({ companyId: world.a.companyId, id });
    expect(detail.comments.map((c) => c.body)).toEqual(["Add a hanger at the elbow."]);
    expect(detail.findings.length).toBeGreaterThan(20);
    const text = (await inspections.getInspectionJsonBody({ companyId: world.a.companyId, id })).toString("utf8");
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify({ inspection: detail })));
    // The stored text itself is what goes out.
    const stored = (await db("inspections").where({ id }).first("findings_json")).findings_json as string;
    expect(text).toContain(`"findings":${stored}}}`);
    // …as stored, byte for byte (a parse and re-write would drop these spaces).
    await db("inspections").where({ id }).update({ findings_json: '[ { "code": "spaced" } ]' });
    expect((await inspections.getInspectionJsonBody({ companyId: world.a.companyId, id })).toString("utf8")).toContain('"findings":[ { "code": "spaced" } ]}}');

    for (const [damaged, expected] of [["[{\"code\": \"cut", []], ["", []], ['{"not":"a list"}', { not: "a list" }]] as const) {
      await db("inspections").where({ id }).update({ findings_json: damaged });
      const answer = JSON.parse((await inspections.getInspectionJsonBody({ companyId: world.a.companyId, id })).toString("utf8"));
      expect(answer.inspection.findings).toEqual(expected);
      expect(answer.inspection.findings).toEqual((await inspections.getInspection({ companyId: world.a.companyId, id })).findings);
    }
    await expectAppError(inspections.getInspectionJsonBody({ companyId: world.b.companyId, id }), "not_found");
  });

  test("autosave uses versions: a stale save is a conflict and changes nothing", async () => {
    const { id } = await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId });
    const data = inspectionDataSchema.parse({ ...exampleInspectionData(), notes: "first" });
    const first = await inspections.saveDraft({ member: world.a.installer, id, version: 1, data });
    expect(first.version).toBe(2);
    await expectAppError(inspections.saveDraft({ member: world.a.supervisor, id, version: 1, data: { ...data, notes: "stale" } }), "conflict");
    expect((await inspections.getInspection({ companyId: world.a.companyId, id })).data.notes).toBe("first");
  });

  test("submit needs every fail and needs-info fixed or justified; then the draft is read-only", async () => {
    const { id } = await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId });
    const data = inspectionDataSchema.parse(exampleInspectionData());
    await inspections.saveDraft({ member: world.a.installer, id, version: 1, data });
    await expectAppError(inspections.submitInspection({ member: world.a.installer, id, version: 2, typedName: "I One", signaturePng: SIGNATURE }), "unprocessable");

    const detail = await inspections.getInspection({ companyId: world.a.companyId, id });
    const justifications = Object.fromEntries(
      submissionBlockers(detail.findings, {}).map((f) => [findingKey(f), { text: "Manufacturer's instructions allow this arrangement.", reference: "Manual p. 12" }]),
    );
    await inspections.saveDraft({ member: world.a.installer, id, version: 2, data: { ...data, justifications } });
    const submitted = await inspections.submitInspection({ member: world.a.installer, id, version: 3, typedName: "I One", signaturePng: SIGNATURE });
    expect(submitted.status).toBe("submitted");
    expect(submitted.installerSignedName).toBe("I One");
    await expectAppError(inspections.saveDraft({ member: world.a.installer, id, version: submitted.version, data }), "unprocessable");
  });

  test("return with comments, resubmit, approve exactly once, correct as revision 2 which supersedes revision 1", async () => {
    const { id } = await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId });
    const data = inspectionDataSchema.parse(exampleInspectionData());
    let saved = await inspections.saveDraft({ member: world.a.installer, id, version: 1, data });
    const blockers = submissionBlockers(saved.findings, {});
    const justified = { ...data, justifications: Object.fromEntries(blockers.map((f) => [findingKey(f), { text: "Allowed by the manufacturer's instructions.", reference: "p. 3" }])) };
    saved = await inspections.saveDraft({ member: world.a.installer, id, version: saved.version, data: justified });
    await inspections.submitInspection({ member: world.a.installer, id, version: saved.version, typedName: "I One", signaturePng: SIGNATURE });

    const returned = await inspections.returnInspection({ member: world.a.supervisor, id, comments: [{ section: "ventRun", body: "Re-hang segment 2 to rise toward the vent." }] });
    expect(returned.status).toBe("returned");
    expect(returned.comments.map((c) => c.body)).toContain("Re-hang segment 2 to rise toward the vent.");

    const again = await inspections.submitInspection({ member: world.a.installer, id, version: returned.version, typedName: "I One", signaturePng: SIGNATURE });
    const results = await Promise.allSettled([
      inspections.approveInspection({ member: world.a.supervisor, id, typedName: "S One", signaturePng: SIGNATURE, baseUrl: "http://flueward.test" }),
      inspections.approveInspection({ member: world.a.supervisor, id, typedName: "S One", signaturePng: SIGNATURE, baseUrl: "http://flueward.test" }),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(again.status).toBe("submitted");
    const approved = await inspections.getInspection({ companyId: world.a.companyId, id });
    expect(approved.status).toBe("approved");
    await expectAppError(inspections.saveDraft({ member: world.a.supervisor, id, version: approved.version, data }), "unprocessable");

    const { id: revisionId } = await inspections.reviseInspection({ member: world.a.supervisor, id });
    const revision = await inspections.getInspection({ companyId: world.a.companyId, id: revisionId });
    expect(revision.revision).toBe(2);
    expect(revision.status).toBe("draft");
    expect(revision.data).toEqual(approved.data);
    await expectAppError(inspections.reviseInspection({ member: world.a.supervisor, id }), "conflict");

    const r2 = await inspections.submitInspection({ member: world.a.installer, id: revisionId, version: revision.version, typedName: "I One", signaturePng: SIGNATURE });
    await inspections.approveInspection({ member: world.a.supervisor, id: r2.id, typedName: "S One", signaturePng: SIGNATURE, baseUrl: "http://flueward.test" });
    expect((await inspections.getInspection({ companyId: world.a.companyId, id })).status).toBe("superseded");
    expect((await inspections.getInspection({ companyId: world.a.companyId, id: revisionId })).revisions.map((r) => r.revision)).toEqual([1, 2]);

    const actions = (await db("audit_events").where({ company_id: world.a.companyId, entity_type: "inspection", entity_id: id }).select("action")).map((r) => r.action);
    expect(actions).toEqual(expect.arrayContaining(["inspection.draft_saved", "inspection.submitted", "inspection.returned", "inspection.approved", "inspection.revision_opened"]));
  });

  test("another company's inspection is not found, for reading and for writing", async () => {
    const { id } = await inspections.createInspection({ member: world.b.installer, jobId: world.b.jobId });
    await expectAppError(inspections.getInspection({ companyId: world.a.companyId, id }), "not_found");
    await expectAppError(inspections.saveDraft({ member: world.a.supervisor, id, version: 1, data: inspectionDataSchema.parse({}) }), "not_found");
    await expectAppError(inspections.approveInspection({ member: world.a.supervisor, id, typedName: "x", signaturePng: SIGNATURE, baseUrl: "http://flueward.test" }), "not_found");
    await expectAppError(inspections.createInspection({ member: world.a.installer, jobId: world.b.jobId }), "not_found");
  });

  test("an installer who is not on the inspection cannot change it", async () => {
    const { id } = await inspections.createInspection({ member: world.a.installer, jobId: world.a.jobId });
    const stranger = { ...world.a.installer, userId: world.a.supervisor.userId + 1000 };
    await expectAppError(inspections.saveDraft({ member: stranger, id, version: 1, data: inspectionDataSchema.parse({}) }), "forbidden");
  });
});

describe("justification rules", () => {
  const finding = (status: "pass" | "fail" | "warn" | "needs-info") => ({
    code: "connector.slope",
    status,
    title: "Connector slope",
    message: "",
    citation: null,
    ruleRef: null,
    safety: null,
    target: { section: "ventRun", itemId: "seg-1", field: "riseIn", path: "ventRun.segments.0.riseIn" },
  });
  test.each([
    ["a pass never blocks", "pass", undefined, 0],
    ["a warning never blocks", "warn", undefined, 0],
    ["a fail without justification blocks", "fail", undefined, 1],
    ["a needs-info without justification blocks", "needs-info", undefined, 1],
    ["a too-short justification blocks", "fail", "ok per me", 1],
    ["a written justification clears it", "fail", "The manufacturer allows a 1/8 in slope, manual p. 22.", 0],
  ] as const)("%s", (_name, status, text, blocking) => {
    const f = finding(status);
    const justifications = text ? { [findingKey(f)]: { text, reference: "" } } : {};
    expect(submissionBlockers([f], justifications)).toHaveLength(blocking);
  });
});
