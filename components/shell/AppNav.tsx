import Link from "next/link";
import type { UserRole } from "@/db/schema";
import { Wordmark } from "./Wordmark";

const sections = [
  { href: "/bench", label: "Bench" },
  { href: "/drills", label: "Drills" },
  { href: "/assignments", label: "Assignments" },
  { href: "/cohorts", label: "Cohorts" },
  { href: "/twins", label: "Twins" },
  { href: "/records", label: "Records" },
];

export function AppNav({ user, signOut, mailbox }: { user: { displayName: string; role: UserRole }; signOut: () => Promise<void>; mailbox: boolean }) {
  return (
    <header className="border-b border-rule bg-paper-raised">
      <nav className="mx-auto flex max-w-[100rem] items-center gap-6 px-6 py-2.5 text-sm" aria-label="Main">
        <Link href="/dashboard" className="no-underline">
          <Wordmark />
        </Link>
        <ul className="flex gap-4">
          {sections.map((s) => (
            <li key={s.href}>
              <Link href={s.href} className="text-ink-soft no-underline hover:text-ink">
                {s.label}
              </Link>
            </li>
          ))}
          {user.role === "admin" ? (
            <li>
              <Link href="/admin/users" className="text-ink-soft no-underline hover:text-ink">
                Organisation
              </Link>
            </li>
          ) : null}
          {user.role === "admin" && mailbox ? (
            <li>
              <Link href="/admin/mailbox" className="text-ink-soft no-underline hover:text-ink">
                Mailbox
              </Link>
            </li>
          ) : null}
        </ul>
        <div className="ml-auto flex items-center gap-3">
          <Link href="/account" className="text-ink-soft no-underline hover:text-ink">
            {user.displayName} <span className="text-ink-faint">· {user.role}</span>
          </Link>
          <form action={signOut}>
            <button type="submit" className="rounded-sm border border-rule-strong px-2.5 py-1 text-xs hover:border-ink">
              Sign out
            </button>
          </form>
        </div>
      </nav>
    </header>
  );
}
