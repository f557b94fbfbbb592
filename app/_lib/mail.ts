// Outgoing mail through nodemailer over SMTP. In a local or demo installation the start command
// points SMTP at the project's own catcher (app/_lib/mail-catcher.ts).
import nodemailer, { type Transporter } from "nodemailer";
import { appConfig } from "./config";

let transport: Transporter | null = null;

function transporter(): Transporter {
  const c = appConfig();
  transport ??= nodemailer.createTransport({
    host: c.SMTP_HOST,
    port: c.SMTP_PORT,
    secure: c.SMTP_SECURE === "true",
    auth: c.SMTP_USER ? { user: c.SMTP_USER, pass: c.SMTP_PASSWORD ?? "" } : undefined,
    // the local catcher speaks plain SMTP on loopback
    ignoreTLS: c.SMTP_HOST === "127.0.0.1" && c.SMTP_SECURE !== "true",
  });
  return transport;
}

export async function sendMail(message: { to: string; subject: string; text: string }): Promise<void> {
  await transporter().sendMail({ from: appConfig().MAIL_FROM, ...message });
}

export const appLink = (pathname: string) => new URL(pathname, appConfig().APP_URL).toString();

export function invitationMail(p: { to: string; inviter: string; organization: string; cohort: string | null; link: string; expires: Date }) {
  const where = p.cohort ? `the cohort "${p.cohort}" at ${p.organization}` : p.organization;
  return {
    to: p.to,
    subject: "Your Loopwright invitation",
    text: [
      `${p.inviter} has invited you to Loopwright, ${where}.`,
      "",
      `Create your account here: ${p.link}`,
      "",
      `The link works once and expires ${p.expires.toUTCString()}.`,
      "If you were not expecting this, ignore this message.",
    ].join("\n"),
  };
}

export function passwordResetMail(p: { to: string; link: string; expires: Date }) {
  return {
    to: p.to,
    subject: "Reset your Loopwright password",
    text: [
      "Someone asked to reset the password of this Loopwright account.",
      "",
      `Choose a new password here: ${p.link}`,
      "",
      `The link works once and expires ${p.expires.toUTCString()}. Resetting signs you out everywhere.`,
      "If it was not you, ignore this message: your password stays as it is.",
    ].join("\n"),
  };
}
