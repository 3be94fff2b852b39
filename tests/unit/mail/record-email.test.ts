import { describe, expect, test } from "vitest";
import {
  CAUTION_EMERGENCY,
  CAUTION_GOVERNS,
  INVALID_URL_MESSAGE,
  composeRecordEmail,
  escapeHtml,
  recordEmailSubject,
  recordPdfAttachment,
  type RecordEmailInput,
} from "@/lib/mail/record-email";

const base: RecordEmailInput = {
  companyName: "Maple Hollow Heating & Cooling",
  companyPhone: "555-0142",
  companyEmail: "office@maplehollow.example",
  siteAddress: "12 Birchfield Way, Lowmarsh",
  audience: "homeowner",
  recipientName: "Dana Whitlock",
  recordNumber: "R-000042",
  revision: 2,
  approvedAt: "2026-11-30T15:20:00.000Z",
  shareUrl: "https://records.example.test/share/Qm9ndXMtdG9rZW4tZm9yLXRlc3Rz",
  linkExpiresAt: "2027-01-15T12:00:00.000Z",
  verificationCode: "FW7K-3QPD-M2XA",
  verifyUrl: "https://records.example.test/verify?code=FW7K-3QPD-M2XA",
  pdfAttached: true,
};

describe("the record e-mail", () => {
  test("subject names the company and the site", () => {
    expect(composeRecordEmail(base).subject).toBe("Your inspection record from Maple Hollow Heating & Cooling — 12 Birchfield Way, Lowmarsh");
  });

  test("text and HTML both carry the share link, the expiry, the code, the verify link and the caution", () => {
    const { text, html } = composeRecordEmail(base);
    for (const body of [text, html]) {
      expect(body).toContain(base.shareUrl);
      expect(body).toContain("January 15, 2027");
      expect(body).toContain("FW7K-3QPD-M2XA");
      expect(body).toContain("https://records.example.test/verify?code=FW7K-3QPD-M2XA");
      expect(body).toContain("R-000042");
      expect(body).toContain("attached");
    }
    expect(text).toContain(CAUTION_GOVERNS);
    expect(text).toContain("is not a substitute for an inspection by a licensed professional");
    expect(text).toContain(CAUTION_EMERGENCY);
    expect(html).toContain(escapeHtml(CAUTION_GOVERNS));
    expect(html).toContain(escapeHtml(CAUTION_EMERGENCY));
    expect(html).toContain(`href="${base.shareUrl}"`);
  });

  test("every interpolated value is escaped in the HTML", () => {
    const hostile = {
      ...base,
      companyName: `<script>alert("co")</script> & Sons`,
      siteAddress: `1 "Quote" St <img src=x onerror=alert(1)>`,
      recipientName: "<b>Eve</b>",
      recordNumber: "R-<1>",
      verificationCode: "A'B\"C<",
      companyPhone: "<i>555</i>",
      shareUrl: `https://records.example.test/share/tok"en?a=1&b=<2>`,
    };
    const { html, text, subject } = composeRecordEmail(hostile);
    expect(html).not.toMatch(/<script|<img|<b>|<i>|onerror=alert\(1\)>/);
    expect(html).toContain("&lt;script&gt;alert(&quot;co&quot;)&lt;/script&gt; &amp; Sons");
    expect(html).toContain("1 &quot;Quote&quot; St &lt;img src=x onerror=alert(1)&gt;");
    expect(html).toContain("A&#39;B&quot;C&lt;");
    // URLs are normalised by the URL parser, then escaped inside the attribute.
    expect(html).toContain('href="https://records.example.test/share/tok%22en?a=1&amp;b=%3C2%3E"');
    // The text part is plain text: left as typed.
    expect(text).toContain(`<script>alert("co")</script> & Sons`);
    expect(subject).toContain(`<script>alert("co")</script> & Sons`);
  });

  test("links that are not http(s) are refused", () => {
    expect(() => composeRecordEmail({ ...base, shareUrl: "javascript:alert(1)" })).toThrow(INVALID_URL_MESSAGE);
    expect(() => composeRecordEmail({ ...base, verifyUrl: "/verify" })).toThrow(INVALID_URL_MESSAGE);
  });

  test("the subject is one line and at most 300 characters", () => {
    const subject = recordEmailSubject("Line\r\nBcc: someone@example.test", "x".repeat(400));
    expect(subject).not.toMatch(/[\r\n]/);
    expect(subject.length).toBeLessThanOrEqual(300);
  });

  test("the inspector wording differs, the PDF line goes when nothing is attached", () => {
    const { text } = composeRecordEmail({ ...base, audience: "inspector", pdfAttached: false, recipientName: undefined });
    expect(text).toContain("for your review");
    expect(text).not.toContain("attached");
    expect(text.startsWith("Hello,")).toBe(true);
  });

  test("dates follow the given time zone", () => {
    const { text } = composeRecordEmail({ ...base, linkExpiresAt: "2027-01-15T03:00:00.000Z", timeZone: "America/Chicago" });
    expect(text).toContain("January 14, 2027");
  });

  test("the PDF attachment is named after the record and revision", () => {
    const attachment = recordPdfAttachment({ recordNumber: "R-000042", revision: 2, bytes: new Uint8Array([37, 80, 68, 70]) });
    expect(attachment).toMatchObject({ filename: "flueward-record-R-000042-rev2.pdf", contentType: "application/pdf" });
  });
});
