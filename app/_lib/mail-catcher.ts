// The local SMTP catcher: accepts mail on loopback and stores it in PostgreSQL (caught_mail),
// where admins read it on the mailbox page when MAILBOX_ENABLED=true. For local and demo
// installations in place of a hosted mail service; production points SMTP_* at a real relay.
import { simpleParser } from "mailparser";
import postgres from "postgres";
import { SMTPServer } from "smtp-server";

export async function startMailCatcher(opts: { port: number; databaseUrl: string; host?: string }): Promise<{ close: () => Promise<void> }> {
  const sql = postgres(opts.databaseUrl, { max: 2, onnotice: () => {} });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", async () => {
        try {
          const raw = Buffer.concat(chunks).toString("utf8");
          const parsed = await simpleParser(raw);
          const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
          const to = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          await sql`insert into caught_mail (envelope_from, envelope_to, subject, text_body, raw)
                    values (${from}, ${to}, ${parsed.subject ?? ""}, ${parsed.text ?? ""}, ${raw})`;
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, opts.host ?? "127.0.0.1", () => resolve());
  });
  return {
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await sql.end();
    },
  };
}
