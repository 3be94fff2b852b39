import { rgb, type RGB } from "pdf-lib";

/** A colour from `#rrggbb`. */
export function hex(value: string): RGB {
  const v = value.replace("#", "");
  const n = Number.parseInt(v, 16);
  return rgb(((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255);
}

/** US Letter, portrait, in PDF points. */
export const PAGE = { width: 612, height: 792 } as const;

/**
 * Margins of the text area. The footer sits below `bottom`, the running header above `top`;
 * nothing the layout places may cross these lines (the tests check word boxes against them).
 */
export const MARGIN = { left: 40, right: 40, top: 46, bottom: 66 } as const;

export const CONTENT_WIDTH = PAGE.width - MARGIN.left - MARGIN.right;

/** The record's palette: ink greys, one copper accent, and a colour per finding status. */
export const COLOURS = {
  ink: hex("#1a2126"),
  body: hex("#283239"),
  muted: hex("#475a63"),
  rule: hex("#b9c6cc"),
  hairline: hex("#d5dde1"),
  band: hex("#eef2f4"),
  zebra: hex("#f6f8f9"),
  white: hex("#ffffff"),
  accent: hex("#a74f22"),
  accentSoft: hex("#f9e6d6"),
  cautionBorder: hex("#8a3b12"),
  cautionFill: hex("#fff4e5"),
  cautionInk: hex("#5a2509"),
  pass: hex("#1f6e46"),
  fail: hex("#b3261e"),
  warn: hex("#8a5a00"),
  needsInfo: hex("#2f5a86"),
  notApplicable: hex("#65508a"),
} as const;

/** Type sizes, pt. */
export const SIZE = {
  title: 17,
  company: 14,
  heading: 12.5,
  subheading: 10,
  body: 9,
  table: 8.5,
  small: 8,
  footer: 7.5,
} as const;
