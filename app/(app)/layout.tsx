import type { ReactNode } from "react";
import { mailboxEnabled } from "@/app/_lib/config";
import { guardPage } from "@/app/_lib/guard";
import { AppNav } from "@/components/shell/AppNav";
import { SafetyFooter } from "@/components/shell/SafetyFooter";
import { signOut } from "./actions";

export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await guardPage();
  return (
    <div className="flex min-h-screen flex-col">
      <AppNav user={user} signOut={signOut} mailbox={mailboxEnabled()} />
      <main className="mx-auto w-full max-w-[100rem] flex-1 px-6 py-8">{children}</main>
      <SafetyFooter />
    </div>
  );
}
