import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { mailboxEnabled } from "@/app/_lib/config";
import { guardPage } from "@/app/_lib/guard";
import { recentMail } from "@/db/queries";

export const metadata: Metadata = { title: "Mailbox" };
export const dynamic = "force-dynamic";

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "medium", timeZone: "UTC" });

/** Mail caught by the local SMTP catcher; only when MAILBOX_ENABLED=true (local and demo installs). */
export default async function MailboxPage() {
  const admin = await guardPage({ roles: ["admin"] });
  if (!mailboxEnabled()) notFound();
  const mail = await recentMail(admin.organizationId);
  return (
    <section>
      <h1 className="mb-1 text-xl font-semibold">Mailbox</h1>
      <p className="mb-6 text-sm text-ink-soft">Mail this installation sent to your organisation's people, caught locally instead of being delivered. Newest first.</p>
      {mail.length === 0 ? <p className="text-sm text-ink-faint">Nothing caught yet.</p> : null}
      <ol className="space-y-4">
        {mail.map((m) => (
          <li key={m.id} className="rounded-sm border border-rule bg-paper-raised p-4" data-testid="caught-mail">
            <p className="num text-xs text-ink-faint">{when.format(m.receivedAt)} UTC</p>
            <p className="text-sm">
              <span className="text-ink-faint">to</span> {m.envelopeTo.join(", ")}
            </p>
            <p className="mb-2 font-medium">{m.subject}</p>
            <pre className="whitespace-pre-wrap break-all font-mono text-xs text-ink-soft">{m.textBody}</pre>
          </li>
        ))}
      </ol>
    </section>
  );
}
