import type { Metadata } from "next";
import Link from "next/link";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";
import { askForReset } from "./actions";

export const metadata: Metadata = { title: "Reset password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Reset your password</h1>
      <p className="mb-6 text-sm text-ink-soft">We will e-mail a single-use link to the address of your account.</p>
      <ActionForm action={askForReset} submitLabel="Send reset link">
        <Field label="E-mail" name="email" type="email" autoComplete="username" required />
      </ActionForm>
      <p className="mt-6 text-sm">
        <Link href="/sign-in">Back to sign-in</Link>
      </p>
    </>
  );
}
