import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";
import type { Knex } from "knex";
import { NextRequest } from "next/server";
import { afterAll, beforeAll, beforeEach, describe, expect, test, vi } from "vitest";
import type { Member } from "@/lib/auth/session";
import { createMemoryStorage, type MemoryStorage } from "@/lib/storage/memory";
import { setStorage, type BlobStorage } from "@/lib/storage";
import { createTestDatabase } from "../../fixtures/test-db";

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

const FIXTURES = path.join(process.cwd(), "tests", "fixtures", "photos");
const photo = fs.readFileSync(path.join(FIXTURES, "flue-collar.jpg"));
const notAPhoto = fs.readFileSync(path.join(FIXTURES, "not-a-photo.jpg"));

let db: Knex;
let cleanup: () => Promise<void>;
let storage: MemoryStorage;
const ids = { companyA: 0, companyB: 0, installer: 0, other: 0, supervisorB: 0, draft: 0, submitted: 0, foreign: 0 };

function member(userId: number, companyId: number, role: Member["role"], name: string): Member {
  return { sessionIdHash: "x", userId, companyId, companyName: "Demo", role, name, email: `${name}@example.test`, mustChangePassword: false };
}
const installer = () => member(ids.installer, ids.companyA, "installer", "Ada Installer");
const otherInstaller = () => member(ids.other, ids.companyA, "installer", "Bo Other");
const foreigner = () => member(ids.supervisorB, ids.companyB, "supervisor", "Cy Elsewhere");

async function insertId(table: string, row: Record<string, unknown>): Promise<number> {
  const [inserted] = await db(table).insert(row).returning("id");
  return typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
}

async function seedCompany(name: string) {
  const now = new Date().toISOString();
  const companyId = await insertId("companies", { name, created_at: now, updated_at: now });
  const user = (n: string, role: string) =>
    insertId("users", { company_id: companyId, email: `${n}-${companyId}@example.test`, name: n, password_hash: "x", role, password_changed_at: now, created_at: now, updated_at: now });
  const rulebookId = await insertId("rulebooks", { company_id: companyId, name: "Demo rules", created_at: now, updated_at: now });
  const versionId = await insertId("rulebook_versions", { company_id: companyId, rulebook_id: rulebookId, version_number: 1, content_json: "{}", content_sha256: "0".repeat(64), created_at: now });
  const jobId = await insertId("jobs", { company_id: companyId, reference: "J-0001", customer_name: "Demo Customer", site_street: "1 Example Lane", site_city: "Sampleton", status: "scheduled", created_at: now, updated_at: now });
  const inspection = (status: string, installerId: number) =>
    insertId("inspections", { company_id: companyId, job_id: jobId, status, rulebook_version_id: versionId, data_json: "{}", installer_id: installerId, created_by: installerId, created_at: now, updated_at: now });
  return { companyId, user, inspection };
}

async function upload(inspectionId: number, file: Uint8Array | null, fields: Record<string, string> = {}, name = "IMG_0001.jpg") {
  const form = new FormData();
  if (file) form.append("file", new Blob([new Uint8Array(file)], { type: "image/jpeg" }), name);
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  const request = new NextRequest(`http://localhost/api/inspections/${inspectionId}/photos`, { method: "POST", body: form });
  const { POST } = await import("@/app/api/inspections/[id]/photos/route");
  return POST(request, { params: Promise.resolve({ id: String(inspectionId) }) });
}

async function listRoute(inspectionId: number) {
  const { GET } = await import("@/app/api/inspections/[id]/photos/route");
  return GET(new NextRequest(`http://localhost/api/inspections/${inspectionId}/photos`), { params: Promise.resolve({ id: String(inspectionId) }) });
}

async function photoRoute(method: "GET" | "PATCH" | "DELETE", photoId: number, options: { query?: string; body?: unknown; headers?: Record<string, string> } = {}) {
  const mod = await import("@/app/api/photos/[id]/route");
  const request = new NextRequest(`http://localhost/api/photos/${photoId}${options.query ?? ""}`, {
    method,
    headers: { ...(options.body !== undefined ? { "content-type": "application/json" } : {}), ...options.headers },
    body: options.body !== undefined ? JSON.stringify(options.body) : undefined,
  });
  return mod[method](request, { params: Promise.resolve({ id: String(photoId) }) });
}

beforeAll(async () => {
  ({ db, cleanup } = await createTestDatabase());
  (globalThis as unknown as { fluewardKnex?: Knex }).fluewardKnex = db;
  const a = await seedCompany("Demo Heating A");
  const b = await seedCompany("Demo Heating B");
  ids.companyA = a.companyId;
  ids.companyB = b.companyId;
  ids.installer = await a.user("ada", "installer");
  ids.other = await a.user("bo", "installer");
  ids.supervisorB = await b.user("cy", "supervisor");
  ids.draft = await a.inspection("draft", ids.installer);
  ids.submitted = await a.inspection("submitted", ids.installer);
  ids.foreign = await b.inspection("draft", ids.supervisorB);
});

afterAll(async () => {
  setStorage(null);
  (globalThis as unknown as { fluewardKnex?: Knex }).fluewardKnex = undefined;
  await cleanup();
});

beforeEach(() => {
  storage = createMemoryStorage();
  setStorage(storage);
  auth.member = installer();
});

describe("POST /api/inspections/:id/photos", () => {
  test("stores a re-encoded photo and its thumbnail, answers 201 with the photo, and audits it", async () => {
    const response = await upload(ids.draft, photo, { caption: "Flue collar before", tag: "before", segmentId: "seg-1" });
    expect(response.status).toBe(201);
    const body = (await response.json()) as { photo: Record<string, unknown> };
    expect(body.photo).toMatchObject({ caption: "Flue collar before", tag: "before", segmentId: "seg-1", siteCheckKey: null, width: 480, height: 360, createdByName: "ada" });
    const id = body.photo.id as number;
    expect(body.photo.urls).toEqual({ full: `/api/photos/${id}`, thumb: `/api/photos/${id}?size=thumb` });
    expect(body.photo).not.toHaveProperty("storage_key");
    expect(JSON.stringify(body)).not.toContain("IMG_0001");
    expect(storage.keys()).toHaveLength(2);
    for (const key of storage.keys()) expect(key).toMatch(new RegExp(`^photos/c${ids.companyA}/[0-9a-f]{32}(-thumb)?\\.jpg$`));
    const audit = await db("audit_events").where({ company_id: ids.companyA, action: "photo.added" }).orderBy("id", "desc").first();
    expect(audit).toMatchObject({ entity_type: "inspection", entity_id: ids.draft, summary: "Added photo 'Flue collar before'" });
  });

  test("a renamed text file is refused with 415 and the message, and nothing is stored", async () => {
    const response = await upload(ids.draft, notAPhoto);
    expect(response.status).toBe(415);
    const body = (await response.json()) as { error: { code: string; message: string; fields: Record<string, string> } };
    expect(body.error.code).toBe("unsupported_media_type");
    expect(body.error.message).toMatch(/not a photo/);
    expect(body.error.fields.file).toMatch(/not a photo/);
    expect(storage.keys()).toEqual([]);
  });

  test("a declared Content-Length over 16 MB is refused with 413 before the body is read", async () => {
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += 1;
        controller.enqueue(new Uint8Array(1024));
      },
    });
    const request = new NextRequest(`http://localhost/api/inspections/${ids.draft}/photos`, {
      method: "POST",
      headers: { "content-type": "multipart/form-data; boundary=x", "content-length": String(17 * 1024 * 1024) },
      body,
      duplex: "half",
    } as unknown as ConstructorParameters<typeof NextRequest>[1]);
    const { POST } = await import("@/app/api/inspections/[id]/photos/route");
    const response = await POST(request, { params: Promise.resolve({ id: String(ids.draft) }) });
    expect(response.status).toBe(413);
    expect(((await response.json()) as { error: { message: string } }).error.message).toMatch(/16 MB/);
    expect(pulled).toBeLessThanOrEqual(1);
  });

  test("a body without Content-Length is counted while read and cut off past 16 MB", async () => {
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        sent += 1024 * 1024;
        controller.enqueue(new Uint8Array(1024 * 1024));
        if (sent > 64 * 1024 * 1024) controller.close();
      },
    });
    const request = new NextRequest(`http://localhost/api/inspections/${ids.draft}/photos`, {
      method: "POST",
      headers: { "content-type": "multipart/form-data; boundary=x" },
      body,
      duplex: "half",
    } as unknown as ConstructorParameters<typeof NextRequest>[1]);
    const { POST } = await import("@/app/api/inspections/[id]/photos/route");
    const response = await POST(request, { params: Promise.resolve({ id: String(ids.draft) }) });
    expect(response.status).toBe(413);
    expect(sent).toBeLessThan(20 * 1024 * 1024);
  });

  test("a file over 15 MB is refused with the limit in the message", async () => {
    const big = new Uint8Array(15 * 1024 * 1024 + 10);
    const response = await upload(ids.draft, big);
    expect(response.status).toBe(413);
    expect(((await response.json()) as { error: { message: string } }).error.message).toMatch(/the limit is 15 MB/);
  });

  test("no file, JSON instead of a form, or a bad tag are refused with clear errors", async () => {
    expect((await upload(ids.draft, null)).status).toBe(400);
    const { POST } = await import("@/app/api/inspections/[id]/photos/route");
    const json = new NextRequest(`http://localhost/api/inspections/${ids.draft}/photos`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
    expect((await POST(json, { params: Promise.resolve({ id: String(ids.draft) }) })).status).toBe(415);
    const badTag = await upload(ids.draft, photo, { tag: "during" });
    expect(badTag.status).toBe(400);
    expect(((await badTag.json()) as { error: { fields: Record<string, string> } }).error.fields.tag).toBeTruthy();
    const both = await upload(ids.draft, photo, { segmentId: "seg-1", siteCheckKey: "joints_fastened" });
    expect(both.status).toBe(400);
    expect(storage.keys()).toEqual([]);
  });

  test("who may upload: signed out 401, another installer 403, submitted 422, other company 404", async () => {
    auth.member = null;
    expect((await upload(ids.draft, photo)).status).toBe(401);
    auth.member = otherInstaller();
    expect((await upload(ids.draft, photo)).status).toBe(403);
    auth.member = installer();
    expect((await upload(ids.submitted, photo)).status).toBe(422);
    expect((await upload(ids.foreign, photo)).status).toBe(404);
    auth.member = foreigner();
    expect((await upload(ids.draft, photo)).status).toBe(404);
    expect(storage.keys()).toEqual([]);
  });

  test("if the row cannot be written, the stored files are removed again", async () => {
    const { addPhoto } = await import("@/lib/data/photos");
    const { processPhoto } = await import("@/lib/photos/process");
    const processed = await processPhoto(photo);
    await expect(
      addPhoto({ companyId: ids.companyA, inspectionId: 999_999, actor: { userId: ids.installer, name: "Ada" }, processed, values: { caption: "", tag: "none", segmentId: null, siteCheckKey: null }, storage }),
    ).rejects.toMatchObject({ code: "not_found" });
    expect(storage.keys()).toEqual([]);
  });

  test("if storage fails, no row is written", async () => {
    const failing: BlobStorage = { driver: "memory", put: async () => Promise.reject(new Error("disk full")), get: async () => null, delete: async () => undefined };
    setStorage(failing);
    const before = await db("photos").count<{ n: number }[]>({ n: "id" }).first();
    const spy = vi.spyOn(console, "error").mockImplementation(() => undefined);
    expect((await upload(ids.draft, photo)).status).toBe(500);
    spy.mockRestore();
    expect(await db("photos").count<{ n: number }[]>({ n: "id" }).first()).toEqual(before);
  });
});

describe("GET, PATCH and DELETE /api/photos/:id", () => {
  async function uploaded(fields: Record<string, string> = {}) {
    const response = await upload(ids.draft, photo, fields);
    return ((await response.json()) as { photo: { id: number } }).photo.id;
  }

  test("serves the stored JPEG (and its thumbnail) with headers that never let it run as a page", async () => {
    const id = await uploaded();
    const response = await photoRoute("GET", id);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("image/jpeg");
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("content-disposition")).toBe(`inline; filename="photo-${id}.jpg"`);
    expect(response.headers.get("content-security-policy")).toBe("default-src 'none'; sandbox");
    expect(response.headers.get("cache-control")).toBe("private, max-age=3600");
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect((await sharp(bytes).metadata()).width).toBe(480);

    const thumb = await photoRoute("GET", id, { query: "?size=thumb" });
    expect(thumb.headers.get("content-type")).toBe("image/jpeg");
    expect((await sharp(new Uint8Array(await thumb.arrayBuffer())).metadata()).width).toBe(320);

    const again = await photoRoute("GET", id, { headers: { "if-none-match": response.headers.get("etag")! } });
    expect(again.status).toBe(304);
    expect((await photoRoute("GET", id, { query: "?size=huge" })).status).toBe(400);
  });

  test("any member of the company may read; another company gets 404", async () => {
    const id = await uploaded();
    auth.member = otherInstaller();
    expect((await photoRoute("GET", id)).status).toBe(200);
    expect((await listRoute(ids.draft)).status).toBe(200);
    auth.member = foreigner();
    expect((await photoRoute("GET", id)).status).toBe(404);
    expect((await listRoute(ids.draft)).status).toBe(404);
    auth.member = null;
    expect((await photoRoute("GET", id)).status).toBe(401);
  });

  test("PATCH changes caption, tag and attachment, one attachment replacing the other, and audits it", async () => {
    const id = await uploaded({ segmentId: "seg-2" });
    const response = await photoRoute("PATCH", id, { body: { caption: "Connector joint after", tag: "after", siteCheckKey: "joints_fastened" } });
    expect(response.status).toBe(200);
    expect(((await response.json()) as { photo: unknown }).photo).toMatchObject({ caption: "Connector joint after", tag: "after", segmentId: null, siteCheckKey: "joints_fastened" });
    const audit = await db("audit_events").where({ action: "photo.updated", entity_id: ids.draft }).orderBy("id", "desc").first();
    expect(audit.summary).toBe("Updated caption, tag, segmentId, siteCheckKey of photo 'Connector joint after'");

    expect((await photoRoute("PATCH", id, { body: { caption: "x".repeat(301) } })).status).toBe(400);
    expect((await photoRoute("PATCH", id, { body: { storage_key: "../../etc" } })).status).toBe(400);
    expect((await photoRoute("PATCH", id, { body: {} })).status).toBe(400);
    auth.member = otherInstaller();
    expect((await photoRoute("PATCH", id, { body: { caption: "mine now" } })).status).toBe(403);
    auth.member = foreigner();
    expect((await photoRoute("PATCH", id, { body: { caption: "mine now" } })).status).toBe(404);
  });

  test("DELETE hides the photo (soft delete) and audits it; it is then 404 and gone from the list", async () => {
    const id = await uploaded({ caption: "Vent cap" });
    auth.member = otherInstaller();
    expect((await photoRoute("DELETE", id)).status).toBe(403);
    auth.member = installer();
    expect((await photoRoute("DELETE", id)).status).toBe(204);
    expect((await db("photos").where({ id }).first()).deleted_at).toBeTruthy();
    expect((await photoRoute("GET", id)).status).toBe(404);
    const list = (await (await listRoute(ids.draft)).json()) as { photos: { id: number }[] };
    expect(list.photos.map((p) => p.id)).not.toContain(id);
    const audit = await db("audit_events").where({ action: "photo.deleted" }).orderBy("id", "desc").first();
    expect(audit.summary).toBe("Deleted photo 'Vent cap'");
    expect(storage.keys()).toHaveLength(2);
  });

  test("photos of a submitted inspection can be read but not changed", async () => {
    const id = await uploaded();
    await db("inspections").where({ id: ids.draft }).update({ status: "submitted" });
    try {
      expect((await photoRoute("GET", id)).status).toBe(200);
      expect((await photoRoute("PATCH", id, { body: { caption: "late" } })).status).toBe(422);
      expect((await photoRoute("DELETE", id)).status).toBe(422);
    } finally {
      await db("inspections").where({ id: ids.draft }).update({ status: "draft" });
    }
  });
});
