import type { Metadata } from "next";
import Link from "next/link";
import { findUsableResetToken } from "@/app/_lib/accounts";
import { tokenField } from "@/app/_lib/fields";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";
import { chooseNewPassword } from "./actions";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const usable = tokenField.safeParse(token).success && (await findUsableResetToken(token));
  if (!usable) {
    return (
      <>
        <h1 className="mb-2 text-lg font-semibold">This link no longer works</h1>
        <p className="text-sm text-ink-soft">
          Reset links work once and expire after 60 minutes. <Link href="/forgot-password">Ask for a new one</Link>.
        </p>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Choose a new password</h1>
      <p className="mb-6 text-sm text-ink-soft">Saving it signs this account out on every device.</p>
      <ActionForm action={chooseNewPassword} submitLabel="Save new password">
        <input type="hidden" name="token" value={token} />
        <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." required />
        <Field label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" required />
      </ActionForm>
    </>
  );
}
