import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";
import { changeOwnPassword } from "./actions";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const user = await guardPage();
  return (
    <section className="max-w-md">
      <h1 className="mb-1 text-xl font-semibold">Account</h1>
      <p className="mb-6 text-sm text-ink-soft">
        {user.displayName} · {user.email} · {user.role}
      </p>
      <h2 className="mb-3 text-sm font-semibold">Change password</h2>
      <ActionForm action={changeOwnPassword} submitLabel="Change password">
        <Field label="Current password" name="current" type="password" autoComplete="current-password" required />
        <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." required />
        <Field label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" required />
      </ActionForm>
    </section>
  );
}
