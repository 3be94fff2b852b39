import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { assertDrawnSignature, checkSignaturePng } from "@/lib/signature/validate-png";
import { SIGNATURE_MESSAGES, SIGNATURE_PNG_MAX_CHARS, signatureSchema } from "@/lib/schemas/signature";

const WIDTH = 600;
const HEIGHT = 200;

/** A transparent RGBA canvas, optionally with a dark diagonal stroke, as a PNG data URL. */
async function pngDataUrl(options: { stroke: boolean; background?: [number, number, number, number] }): Promise<string> {
  const [r, g, b, a] = options.background ?? [0, 0, 0, 0];
  const raw = Buffer.alloc(WIDTH * HEIGHT * 4);
  for (let i = 0; i < WIDTH * HEIGHT; i++) raw.set([r, g, b, a], i * 4);
  if (options.stroke) {
    for (let x = 50; x < 550; x++) {
      const y = Math.round(150 - (x - 50) * 0.2);
      for (let dy = -2; dy <= 2; dy++) raw.set([20, 20, 60, 255], ((y + dy) * WIDTH + x) * 4);
    }
  }
  const png = await sharp(raw, { raw: { width: WIDTH, height: HEIGHT, channels: 4 } }).png().toBuffer();
  return `data:image/png;base64,${png.toString("base64")}`;
}

describe("checkSignaturePng", () => {
  it("accepts a PNG with a drawn stroke", async () => {
    const result = await checkSignaturePng(await pngDataUrl({ stroke: true }));
    expect(result).toMatchObject({ ok: true, width: WIDTH, height: HEIGHT });
  });

  it("accepts a stroke on an opaque white background", async () => {
    expect((await checkSignaturePng(await pngDataUrl({ stroke: true, background: [255, 255, 255, 255] }))).ok).toBe(true);
  });

  it("refuses a blank transparent PNG", async () => {
    expect(await checkSignaturePng(await pngDataUrl({ stroke: false }))).toEqual({ ok: false, message: SIGNATURE_MESSAGES.blank });
  });

  it("refuses a PNG of one uniform colour", async () => {
    expect(await checkSignaturePng(await pngDataUrl({ stroke: false, background: [255, 255, 255, 255] }))).toEqual({ ok: false, message: SIGNATURE_MESSAGES.blank });
  });

  it("refuses bytes that are not a PNG, even under a PNG data-URL prefix", async () => {
    const jpeg = await sharp({ create: { width: 20, height: 20, channels: 3, background: "#336" } }).jpeg().toBuffer();
    const text = Buffer.from("this is a signature, honestly");
    for (const bytes of [jpeg, text]) {
      expect(await checkSignaturePng(`data:image/png;base64,${bytes.toString("base64")}`)).toEqual({ ok: false, message: SIGNATURE_MESSAGES.unreadable });
    }
  });

  it("refuses a PNG header followed by garbage", async () => {
    const fake = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.from("not really a png at all")]);
    expect((await checkSignaturePng(`data:image/png;base64,${fake.toString("base64")}`)).ok).toBe(false);
  });

  it("refuses malformed base64 and other data-URL types", async () => {
    expect((await checkSignaturePng("data:image/png;base64,@@@@")).ok).toBe(false);
    expect(await checkSignaturePng("data:image/jpeg;base64,AAAA")).toEqual({ ok: false, message: SIGNATURE_MESSAGES.drawn });
  });

  it("refuses an oversize data URL before decoding it", async () => {
    const huge = `data:image/png;base64,${"A".repeat(SIGNATURE_PNG_MAX_CHARS)}`;
    expect(await checkSignaturePng(huge)).toEqual({ ok: false, message: SIGNATURE_MESSAGES.tooLarge });
  });
});

describe("assertDrawnSignature", () => {
  it("throws validation_failed with the message under the field", async () => {
    await expect(assertDrawnSignature(await pngDataUrl({ stroke: false }))).rejects.toMatchObject({
      code: "validation_failed",
      message: SIGNATURE_MESSAGES.blank,
      fields: { "signature.signaturePng": SIGNATURE_MESSAGES.blank },
    });
    await expect(assertDrawnSignature(await pngDataUrl({ stroke: true }))).resolves.toBeUndefined();
  });
});

describe("signatureSchema", () => {
  it("asks for a full name and a drawing", () => {
    const result = signatureSchema.safeParse({ typedName: " A ", signaturePng: null });
    expect(result.success).toBe(false);
    const messages = Object.fromEntries(result.error!.issues.map((i) => [i.path.join("."), i.message]));
    expect(messages).toEqual({ typedName: SIGNATURE_MESSAGES.typedName, signaturePng: SIGNATURE_MESSAGES.drawn });
  });

  it("trims the typed name", () => {
    expect(signatureSchema.parse({ typedName: "  Dana Quill ", signaturePng: "data:image/png;base64,AAAA" }).typedName).toBe("Dana Quill");
  });
});
