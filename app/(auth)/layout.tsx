import type { ReactNode } from "react";
import { SafetyFooter } from "@/components/shell/SafetyFooter";
import { Wordmark } from "@/components/shell/Wordmark";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <main className="mx-auto flex w-full max-w-md flex-1 flex-col justify-center px-6 py-12">
        <Wordmark className="mb-8" />
        <div className="rounded-sm border border-rule bg-paper-raised p-6 shadow-[0_1px_0_var(--color-rule)]">{children}</div>
      </main>
      <SafetyFooter />
    </div>
  );
}
