import sharp from "sharp";

/** A drawn-looking signature as a PNG data URL, for API calls that need one. */
export async function signaturePng(): Promise<string> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="300" height="100"><polyline points="10,70 60,30 110,75 160,25 210,70 260,35" fill="none" stroke="#111" stroke-width="5"/></svg>`;
  const png = await sharp(Buffer.from(svg)).png().toBuffer();
  return `data:image/png;base64,${png.toString("base64")}`;
}
