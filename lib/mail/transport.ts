import "server-only";
import nodemailer, { type Transporter } from "nodemailer";

/**
 * The one way Flueward sends mail: a nodemailer SMTP transport configured by environment
 * variables. Without SMTP_HOST outside production it talks to the local fake server
 * (scripts/fake-smtp.ts), so development and tests never reach a real mailbox.
 */
export const DEFAULT_MAIL_FROM = "Flueward records <records@flueward.test>";
export const DEFAULT_SMTP_PORT = 587;
export const DEFAULT_FAKE_SMTP_PORT = 2525;
/** Short, so a dead mail server fails a send within seconds instead of hanging the request. */
export const SMTP_TIMEOUT_MS = 10_000;

export interface MailConfig {
  host: string;
  port: number;
  /** TLS from the first byte (usually port 465); otherwise STARTTLS when the server offers it. */
  secure: boolean;
  /** Refuse to send without STARTTLS: on for any non-loopback server unless SMTP_REQUIRE_TLS=false. */
  requireTls: boolean;
  user: string | null;
  password: string | null;
  from: string;
  /** True when talking to the local fake server by default. */
  fake: boolean;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments?: { filename: string; contentType: string; content: Uint8Array }[];
}

/** Mail is not set up on this server; the message says which variable is missing. */
export class MailConfigError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "MailConfigError";
  }
}

type Env = Record<string, string | undefined>;

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "::1" || /^127\./.test(host);
}

function parsePort(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === "") return fallback;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new MailConfigError(`${name} must be a port number (1–65535).`);
  return port;
}

/** Reads the mail settings: SMTP_HOST, SMTP_PORT, SMTP_SECURE, SMTP_USER, SMTP_PASSWORD, MAIL_FROM, FAKE_SMTP_PORT. */
export function mailConfigFromEnv(env: Env = process.env): MailConfig {
  const from = env.MAIL_FROM?.trim() || DEFAULT_MAIL_FROM;
  const host = env.SMTP_HOST?.trim();
  if (!host) {
    if (env.NODE_ENV === "production") throw new MailConfigError("E-mail is not set up on this server: set SMTP_HOST (and SMTP_PORT, SMTP_USER, SMTP_PASSWORD).");
    return {
      host: "127.0.0.1",
      port: parsePort(env.FAKE_SMTP_PORT, DEFAULT_FAKE_SMTP_PORT, "FAKE_SMTP_PORT"),
      secure: false,
      requireTls: false,
      user: null,
      password: null,
      from,
      fake: true,
    };
  }
  const secure = env.SMTP_SECURE === "true";
  return {
    host,
    port: parsePort(env.SMTP_PORT, DEFAULT_SMTP_PORT, "SMTP_PORT"),
    secure,
    requireTls: !secure && !isLoopback(host) && env.SMTP_REQUIRE_TLS !== "false",
    user: env.SMTP_USER || null,
    password: env.SMTP_PASSWORD || null,
    from,
    fake: false,
  };
}

const globalForMail = globalThis as unknown as { fluewardMail?: { key: string; transport: Transporter; config: MailConfig } };

/**
 * The process's transport, built on first use. It is rebuilt only when the mail settings change
 * (tests point it at a fake server on a random port).
 */
export function getMailTransport(env: Env = process.env): { transport: Transporter; config: MailConfig } {
  const config = mailConfigFromEnv(env);
  const key = JSON.stringify(config);
  const cached = globalForMail.fluewardMail;
  if (cached && cached.key === key) return cached;
  cached?.transport.close();
  const transport = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: config.secure,
    requireTLS: config.requireTls,
    ignoreTLS: config.fake,
    auth: config.user ? { user: config.user, pass: config.password ?? "" } : undefined,
    connectionTimeout: SMTP_TIMEOUT_MS,
    greetingTimeout: SMTP_TIMEOUT_MS,
    socketTimeout: SMTP_TIMEOUT_MS * 2,
    dnsTimeout: SMTP_TIMEOUT_MS,
  });
  globalForMail.fluewardMail = { key, transport, config };
  return globalForMail.fluewardMail;
}

/** Sends one message; resolves with the Message-ID the server accepted, or throws the transport's error. */
export async function deliverMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  const { transport, config } = getMailTransport();
  const info = (await transport.sendMail({
    from: config.from,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    attachments: (mail.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.content) })),
  })) as { messageId?: string };
  return { messageId: info.messageId ?? "" };
}

/**
 * A short, safe description of a failed send for the UI and the log table: the kind of failure
 * and the server's status line, never credentials or a stack trace.
 */
export function describeSendError(error: unknown): string {
  if (error instanceof MailConfigError) return error.message;
  const e = (typeof error === "object" && error !== null ? error : {}) as { code?: unknown; responseCode?: unknown; response?: unknown };
  const code = typeof e.code === "string" ? e.code : "";
  const responseCode = typeof e.responseCode === "number" ? e.responseCode : null;
  const firstLine = typeof e.response === "string" ? (e.response.split(/\r?\n/)[0] ?? "").replace(/[^\x20-\x7e]/g, "").slice(0, 160) : "";
  if (code === "EAUTH") return "The mail server refused the sign-in: check SMTP_USER and SMTP_PASSWORD.";
  if (code === "ETLS" || code === "ESTARTTLS") return "Could not set up a secure connection to the mail server.";
  if (["ECONNECTION", "ESOCKET", "ETIMEDOUT", "ECONNREFUSED", "EDNS", "ECONNRESET"].includes(code) && responseCode === null) {
    return "Could not reach the mail server. Try again in a few minutes.";
  }
  if (code === "EENVELOPE" && responseCode === null) return "The mail server refused the recipient address.";
  if (responseCode !== null) {
    const kind = responseCode >= 500 ? "refused the message" : "could not take the message right now";
    return `The mail server ${kind} (${firstLine || responseCode}).`.slice(0, 300);
  }
  return "Sending failed. Try again in a few minutes.";
}
