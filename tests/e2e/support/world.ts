import crypto from "node:crypto";
import sharp from "sharp";
import { expect, request as playwrightRequest, type APIRequestContext, type APIResponse } from "@playwright/test";
import { signaturePng } from "./signature";
import { findingKey, submissionBlockers } from "../../../lib/inspections/evaluate";
import type { InspectionData } from "../../../lib/inspections/data";

/**
 * Throwaway objects for the security tests, created through the API as a company's own
 * members: a job, a draft and an approved inspection with its record, share links (one live,
 * one revoked), an e-mail send, a photo, a rulebook copy and a member. Tests that write to
 * these never disturb the demo objects other spec files rely on.
 */
export interface CompanyWorld {
  jobId: number;
  job: Record<string, unknown>;
  draftInspectionId: number;
  draftData: unknown;
  approvedInspectionId: number;
  recordId: number;
  shareLinkId: number;
  token: string;
  revokedToken: string;
  emailSendId: number;
  photoId: number;
  defaultRulebookId: number;
  rulebookId: number;
  rulebookVersionNumber: number;
  rulebookContent: unknown;
  pinnedRulebookVersionId: number;
  memberId: number;
  siteCheckItem: { id: number; help: string };
  siteCheckIds: number[];
}

/**
 * Sends a request, trying again when the connection itself failed (reset or refused before any
 * answer): on a loaded machine the server may close an idle keep-alive socket just as it is
 * reused. Bounded: three tries.
 */
export async function fetchWithRetry(api: APIRequestContext, url: string, options: Parameters<APIRequestContext["fetch"]>[1]): Promise<APIResponse> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await api.fetch(url, options);
    } catch (error) {
      if (attempt >= 3 || !/ECONNRESET|ECONNREFUSED|socket hang up/.test(String(error))) throw error;
      await new Promise((resolve) => setTimeout(resolve, 250 * attempt));
    }
  }
}

export function unique(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${crypto.randomBytes(3).toString("hex")}`;
}

export async function ok(response: APIResponse, what: string): Promise<Record<string, any>> {
  const text = await response.text();
  expect(response.status(), `${what}: ${text.slice(0, 500)}`).toBeLessThan(300);
  return text ? JSON.parse(text) : {};
}

export async function jpegBytes(): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 180, g: 90, b: 40 } } }).jpeg().toBuffer();
}

export async function uploadPhoto(api: APIRequestContext, inspectionId: number): Promise<number> {
  const body = await ok(
    await api.post(`/api/inspections/${inspectionId}/photos`, { multipart: { file: { name: "flue.jpg", mimeType: "image/jpeg", buffer: await jpegBytes() }, caption: "security test" } }),
    "upload photo",
  );
  return body.photo.id;
}

export async function createShareToken(api: APIRequestContext, recordId: number): Promise<{ id: number; token: string }> {
  const body = await ok(await api.post(`/api/records/${recordId}/share-links`, { data: { audience: "inspector", expiresInDays: 3, label: "security test" } }), "share link");
  const token = /\/share\/([A-Za-z0-9_-]+)/.exec(JSON.stringify(body))?.[1];
  if (!token) throw new Error(`no token in ${JSON.stringify(body)}`);
  return { id: body.shareLink.id, token };
}

/** A member created by the company's admin; returns the id and the temporary password. */
export async function createMember(admin: APIRequestContext, role: "installer" | "supervisor" | "admin", label: string): Promise<{ id: number; email: string; password: string }> {
  const email = `${unique(label)}@security.test`;
  const body = await ok(await admin.post("/api/members", { data: { name: `Security ${label}`, email, role } }), `create member ${label}`);
  return { id: body.member.id, email, password: body.temporaryPassword };
}

/**
 * Signs a new member in and replaces the temporary password with one of their own, as the first
 * sign-in requires before any other API call; returns the client and the new password.
 */
export async function signedInWithOwnPassword(baseURL: string, member: { email: string; password: string }): Promise<{ api: APIRequestContext; password: string }> {
  const api = await signedIn(baseURL, member.email, member.password);
  const password = `${unique("own")} lantern meadow`;
  await ok(await api.post("/api/auth/password", { data: { currentPassword: member.password, newPassword: password, confirmPassword: password } }), `own password for ${member.email}`);
  return { api, password };
}

export async function signedIn(baseURL: string, email: string, password: string): Promise<APIRequestContext> {
  const context = await playwrightRequest.newContext({ baseURL });
  await ok(await context.post("/api/auth/sign-in", { data: { email, password } }), `sign in ${email}`);
  return context;
}

/** The data of the oldest approved demo inspection visible to `api` (the seeded one). */
export async function templateInspectionData(api: APIRequestContext): Promise<unknown> {
  const approved = (await ok(await api.get("/api/inspections?status=approved&pageSize=100"), "approved list")).items as { id: number }[];
  if (!approved.length) throw new Error("no approved inspection to copy");
  return (await ok(await api.get(`/api/inspections/${approved[0]!.id}`), "template")).inspection.data;
}

/**
 * Creates an inspection on `jobId` with `templateData` (complete: fails justified, checks
 * answered) and submits it as `submitter` (the admin when not given); returns its id.
 */
export async function submittedInspection(args: { admin: APIRequestContext; submitter?: APIRequestContext; jobId: number; templateData: unknown }): Promise<number> {
  const { admin } = args;
  const { id } = await ok(await admin.post(`/api/jobs/${args.jobId}/inspections`, { data: {} }), "create inspection");
  let saved = await ok(await admin.put(`/api/inspections/${id}/draft`, { data: { version: 1, data: args.templateData } }), "save draft");
  // Another spec may have changed the current rulebook since the template was approved: justify
  // whatever now blocks submission, as an installer would.
  const blockers = submissionBlockers(saved.findings ?? [], (args.templateData as InspectionData).justifications ?? {});
  if (blockers.length) {
    const data = structuredClone(args.templateData) as InspectionData;
    data.justifications = {
      ...data.justifications,
      ...Object.fromEntries(blockers.map((f) => [findingKey(f), { text: "Test: accepted per the manufacturer's installation instructions.", reference: "Test manual" }])),
    };
    saved = await ok(await admin.put(`/api/inspections/${id}/draft`, { data: { version: saved.version, data } }), "save justified draft");
  }
  await ok(await (args.submitter ?? admin).post(`/api/inspections/${id}/submit`, { data: { version: saved.version, signature: { typedName: "Test Installer", signaturePng: await signaturePng() } } }), "submit");
  return id;
}

/**
 * Builds the objects for one company. `admin` is an admin of the company; `approver` (a
 * supervisor or admin) approves, confirming with `approverPassword`.
 */
export async function buildCompanyWorld(args: {
  admin: APIRequestContext;
  approver: APIRequestContext;
  /** Who submits (becomes the inspection's installer); the admin when not given. */
  submitter?: APIRequestContext;
  approverName: string;
  approverPassword: string;
  assignInstallerName?: string;
  /** Complete inspection data (fails justified, checks answered), e.g. from templateInspectionData. */
  templateData: unknown;
}): Promise<CompanyWorld> {
  const { admin, approver } = args;
  const installers = (await ok(await admin.get("/api/installers"), "installers")).installers as { id: number; name: string }[];
  const assignee = installers.find((i) => i.name === args.assignInstallerName)?.id ?? null;
  const jobBody = {
    customerName: `Security Test ${unique("job")}`,
    siteStreet: "1 Test Row",
    siteCity: "Testbury",
    status: "in_progress",
    assignedInstallerId: assignee,
  };
  const job = (await ok(await admin.post("/api/jobs", { data: jobBody }), "create job")).job;

  // The approved one: data copied from an approved demo inspection (fails justified, checks answered).
  const approvedInspectionId = await submittedInspection({ admin, submitter: args.submitter, jobId: job.id, templateData: args.templateData });
  await ok(
    await approver.post(`/api/inspections/${approvedInspectionId}/approve`, { data: { signature: { typedName: args.approverName, signaturePng: await signaturePng() }, password: args.approverPassword } }),
    "approve",
  );
  const recordId = (await ok(await admin.get(`/api/inspections/${approvedInspectionId}/record`), "record")).records[0].id as number;
  const live = await createShareToken(approver, recordId);
  const revoked = await createShareToken(approver, recordId);
  await ok(await approver.delete(`/api/share-links/${revoked.id}`), "revoke share link");
  const email = await ok(await approver.post(`/api/records/${recordId}/email`, { data: { to: "security.test@homeowner.test", idempotencyKey: unique("key") } }), "email");

  // The draft, for writes: created last so it is the job's newest inspection.
  const { id: draftInspectionId } = await ok(await admin.post(`/api/jobs/${job.id}/inspections`, { data: {} }), "create draft");
  const draft = (await ok(await admin.get(`/api/inspections/${draftInspectionId}`), "draft")).inspection;
  const photoId = await uploadPhoto(admin, draftInspectionId);

  const rulebooks = (await ok(await admin.get("/api/rulebooks"), "rulebooks")).rulebooks as { id: number; isDefault: boolean }[];
  const defaultRulebookId = (rulebooks.find((r) => r.isDefault) ?? rulebooks[0]!).id;
  const copy = await ok(await admin.post("/api/rulebooks", { data: { name: `Security test copy ${unique("rb")}`, copyFromRulebookId: defaultRulebookId } }), "copy rulebook");
  const rulebookId = copy.rulebook.id as number;
  const copied = await ok(await admin.get(`/api/rulebooks/${rulebookId}`), "read rulebook");

  const member = await createMember(admin, "installer", "target");
  const items = (await ok(await admin.get("/api/site-checks?includeInactive=1"), "site checks")).items as { id: number; help: string }[];

  return {
    jobId: job.id,
    job: { ...jobBody, version: job.version ?? 1 },
    draftInspectionId,
    draftData: draft.data,
    approvedInspectionId,
    recordId,
    shareLinkId: live.id,
    token: live.token,
    revokedToken: revoked.token,
    emailSendId: email.emailSend.id,
    photoId,
    defaultRulebookId,
    rulebookId,
    rulebookVersionNumber: copied.latest?.versionNumber ?? 1,
    rulebookContent: copied.latest?.content,
    pinnedRulebookVersionId: draft.rulebookVersion.id,
    memberId: member.id,
    siteCheckItem: { id: items[0]!.id, help: items[0]!.help ?? "" },
    siteCheckIds: items.map((i) => i.id),
  };
}
