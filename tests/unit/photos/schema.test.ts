import { describe, expect, test } from "vitest";
import { attachmentValue, parseAttachmentValue, photoUpdateSchema, photoUploadFieldsSchema } from "@/lib/schemas/photo";

describe("photo schemas", () => {
  test("upload fields default to no caption, no tag and no attachment; empty strings mean none", () => {
    expect(photoUploadFieldsSchema.parse({})).toEqual({ caption: "", tag: "none", segmentId: null, siteCheckKey: null });
    expect(photoUploadFieldsSchema.parse({ caption: "  Vent cap  ", tag: "", segmentId: "", siteCheckKey: "vent_cap" })).toEqual({
      caption: "Vent cap",
      tag: "none",
      segmentId: null,
      siteCheckKey: "vent_cap",
    });
  });

  test.each([
    [{ caption: "x".repeat(301) }, "caption"],
    [{ tag: "during" }, "tag"],
    [{ segmentId: "../etc" }, "segmentId"],
    [{ segmentId: "seg-1", siteCheckKey: "joints_fastened" }, "siteCheckKey"],
  ])("upload fields %j are refused at %s", (input, path) => {
    const result = photoUploadFieldsSchema.safeParse(input);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path.join(".")).toBe(path);
  });

  test("an update needs at least one known field and null detaches", () => {
    expect(photoUpdateSchema.safeParse({}).success).toBe(false);
    expect(photoUpdateSchema.safeParse({ deleted_at: null }).success).toBe(false);
    expect(photoUpdateSchema.parse({ segmentId: "" })).toEqual({ segmentId: null });
  });

  test("attach-to select values round-trip", () => {
    for (const value of ["segment:seg-1", "check:joints_fastened", ""]) expect(attachmentValue(parseAttachmentValue(value))).toBe(value);
  });
});
