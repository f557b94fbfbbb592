import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { currentSession } from "@/app/_lib/auth";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";
import { signIn } from "./actions";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ reset?: string }> }) {
  if ((await currentSession()).user) redirect("/dashboard");
  const { reset } = await searchParams;
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Sign in</h1>
      <p className="mb-6 text-sm text-ink-soft">Accounts are created by invitation from your instructor or administrator.</p>
      {reset ? <p role="status" className="mb-4 text-sm text-ok">Password changed. Sign in with the new one.</p> : null}
      <ActionForm action={signIn} submitLabel="Sign in">
        <Field label="E-mail" name="email" type="email" autoComplete="username" required />
        <Field label="Password" name="password" type="password" autoComplete="current-password" required />
      </ActionForm>
      <p className="mt-6 text-sm">
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
    </>
  );
}
