import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import sharp, { type Sharp } from "sharp";
import { describe, expect, test } from "vitest";
import { LONG_EDGE_PX, MAX_INPUT_PIXELS, PhotoRejectedError, THUMB_LONG_EDGE_PX, processPhoto } from "@/lib/photos/process";
import { MAX_PHOTO_BYTES, PHOTO_MESSAGES } from "@/lib/schemas/photo";

const FIXTURES = path.join(process.cwd(), "tests", "fixtures", "photos");

/** Left half red, right half blue: after a 90° turn the colours tell which way is up. */
async function halves(width: number, height: number) {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><rect width="${width / 2}" height="${height}" fill="#ff0000"/><rect x="${width / 2}" width="${width / 2}" height="${height}" fill="#0000ff"/></svg>`;
  return sharp(Buffer.from(svg));
}

async function pixel(bytes: Uint8Array, x: number, y: number): Promise<[number, number, number]> {
  const { data, info } = await sharp(bytes).raw().toBuffer({ resolveWithObject: true });
  const i = (y * info.width + x) * info.channels;
  return [data[i]!, data[i + 1]!, data[i + 2]!];
}

function isRed([r, g, b]: [number, number, number]) {
  return r > 200 && g < 60 && b < 60;
}
function isBlue([r, g, b]: [number, number, number]) {
  return b > 200 && r < 60 && g < 60;
}

async function rejection(input: Uint8Array): Promise<PhotoRejectedError> {
  try {
    await processPhoto(input);
  } catch (error) {
    if (error instanceof PhotoRejectedError) return error;
    throw error;
  }
  throw new Error("expected the photo to be refused");
}

describe("processPhoto: what is accepted", () => {
  test("a JPEG with EXIF GPS and orientation 6 comes out upright, sides swapped, with no metadata", async () => {
    const input = await (await halves(400, 200))
      .jpeg({ quality: 90 })
      .withMetadata({ orientation: 6 })
      .withExif({ IFD0: { Make: "DemoCam" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "45/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "100/1 15/1 0/1" } })
      .toBuffer();
    const before = await sharp(input).metadata();
    expect(before.orientation).toBe(6);
    // The GPS IFD pointer (tag 0x8825, little-endian in libvips' EXIF) is in the input...
    expect(before.exif?.includes(Buffer.from([0x25, 0x88]))).toBe(true);

    const out = await processPhoto(input);
    expect([out.width, out.height]).toEqual([200, 400]);
    const after = await sharp(out.bytes).metadata();
    expect([after.width, after.height]).toEqual([200, 400]);
    // ...and nothing of it is in the output: no EXIF (so no GPS), no orientation, no XMP, no IPTC.
    expect(after.exif).toBeUndefined();
    expect(after.orientation).toBeUndefined();
    expect(after.xmp).toBeUndefined();
    expect(after.iptc).toBeUndefined();
    expect(Buffer.from(out.bytes).includes(Buffer.from("Exif\0\0"))).toBe(false);
    expect(Buffer.from(out.bytes).includes(Buffer.from("DemoCam"))).toBe(false);
    // Orientation 6 means "turn 90° clockwise to view": the left (red) half ends up on top.
    expect(isRed(await pixel(out.bytes, 100, 20))).toBe(true);
    expect(isBlue(await pixel(out.bytes, 100, 380))).toBe(true);
  });

  test("the committed sideways fixture is stored upright and without its GPS", async () => {
    const out = await processPhoto(fs.readFileSync(path.join(FIXTURES, "rotated-with-gps.jpg")));
    expect([out.width, out.height]).toEqual([480, 360]);
    expect((await sharp(out.bytes).metadata()).exif).toBeUndefined();
  });

  test("a large photo is resized to fit the long edge, with a small thumbnail and its hash", async () => {
    const input = await (await halves(3000, 1500)).jpeg().toBuffer();
    const out = await processPhoto(input);
    expect([out.width, out.height]).toEqual([LONG_EDGE_PX, 1000]);
    const thumb = await sharp(out.thumbBytes).metadata();
    expect(thumb.format).toBe("jpeg");
    expect([thumb.width, thumb.height]).toEqual([THUMB_LONG_EDGE_PX, 160]);
    expect(out.sha256).toBe(crypto.createHash("sha256").update(out.bytes).digest("hex"));
    expect(out.contentType).toBe("image/jpeg");
  });

  test("a small photo is not enlarged", async () => {
    const out = await processPhoto(fs.readFileSync(path.join(FIXTURES, "flue-collar.jpg")));
    expect([out.width, out.height]).toEqual([480, 360]);
    expect(fs.statSync(path.join(FIXTURES, "flue-collar.jpg")).size).toBeLessThan(20_000);
  });

  test.each([
    ["PNG with transparency", (s: Sharp) => s.png(), "image/png"],
    ["WebP", (s: Sharp) => s.webp(), "image/webp"],
  ] as const)("%s is re-encoded as a JPEG", async (_name, encode, sourceType) => {
    const base = sharp({ create: { width: 120, height: 80, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } });
    const out = await processPhoto(await encode(base).toBuffer());
    expect(out.sourceType).toBe(sourceType);
    expect((await sharp(out.bytes).metadata()).format).toBe("jpeg");
    // Transparent pixels become white, not black.
    expect(await pixel(out.bytes, 10, 10)).toEqual([255, 255, 255]);
  });
});

describe("processPhoto: what is refused, always with a message", () => {
  test("a text file renamed .jpg", async () => {
    const error = await rejection(fs.readFileSync(path.join(FIXTURES, "not-a-photo.jpg")));
    expect(error.reason).toBe("not_a_photo");
    expect(error.code).toBe("unsupported_media_type");
    expect(error.message).toBe(PHOTO_MESSAGES.notAPhoto);
    expect(error.fields?.file).toBe(PHOTO_MESSAGES.notAPhoto);
  });

  test("a PDF", async () => {
    const pdf = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
    const error = await rejection(pdf);
    expect(error.reason).toBe("not_a_photo");
    expect(error.message).toMatch(/PDF is refused/);
  });

  test.each([
    ["an SVG carrying a script", Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')],
    ["an HTML page", Buffer.from("<!doctype html><html><body><script>alert(1)</script></body></html>")],
    ["a GIF", Buffer.from("R0lGODlhAQABAIAAAP///wAAACH5BAEAAAAALAAAAAABAAEAAAICRAEAOw==", "base64")],
    ["a ZIP", Buffer.from([0x50, 0x4b, 0x03, 0x04, ...new Array(40).fill(0)])],
  ])("%s", async (_name, bytes) => {
    expect((await rejection(bytes)).reason).toBe("not_a_photo");
  });

  test("an image over the pixel limit, before it is decoded", async () => {
    const input = await sharp({ create: { width: 8000, height: 7000, channels: 3, background: "#ffffff" } }).png({ compressionLevel: 1 }).toBuffer();
    expect(8000 * 7000).toBeGreaterThan(MAX_INPUT_PIXELS);
    const error = await rejection(input);
    expect(error.reason).toBe("too_many_pixels");
    expect(error.code).toBe("payload_too_large");
    expect(error.message).toMatch(/56 megapixels; the limit is 50 megapixels/);
  });

  test("a file over the size limit, before it is read", async () => {
    const big = new Uint8Array(MAX_PHOTO_BYTES + 1);
    big.set([0xff, 0xd8, 0xff, 0xe0]);
    const error = await rejection(big);
    expect(error.reason).toBe("too_large");
    expect(error.message).toMatch(/the limit is 15 MB/);
  });

  test("a truncated JPEG", async () => {
    const noisy = await sharp({ create: { width: 600, height: 400, channels: 3, background: "#000000", noise: { type: "gaussian", mean: 128, sigma: 40 } } }).jpeg().toBuffer();
    const error = await rejection(noisy.subarray(0, Math.floor(noisy.length * 0.6)));
    expect(error.reason).toBe("unreadable");
    expect(error.code).toBe("unprocessable");
    expect(error.message).toMatch(/damaged or incomplete/);
  });

  test("a JPEG header with nothing after it", async () => {
    expect((await rejection(Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00]))).reason).toMatch(/unreadable|not_a_photo/);
  });

  test("a HEIC this server cannot decode gets advice instead of a crash", async () => {
    // An ftyp box naming the HEIC brand, then junk: what a HEIC file looks like to a sniffer.
    const box = Buffer.alloc(24);
    box.writeUInt32BE(24, 0);
    box.write("ftypheic", 4, "latin1");
    box.write("mif1heic", 16, "latin1");
    const error = await rejection(Buffer.concat([box, crypto.randomBytes(200)]));
    expect(error.reason).toBe("heic_unsupported");
    expect(error.message).toMatch(/Most Compatible/);
  });

  test("an empty file", async () => {
    expect((await rejection(new Uint8Array())).reason).toBe("empty");
  });
});
