import type { Metadata } from "next";
import Link from "next/link";
import { findOpenInvitation } from "@/app/_lib/accounts";
import { tokenField } from "@/app/_lib/fields";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";
import { acceptInvite } from "./actions";

export const metadata: Metadata = { title: "Accept invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const found = tokenField.safeParse(token).success ? await findOpenInvitation(token) : null;
  if (!found) {
    return (
      <>
        <h1 className="mb-2 text-lg font-semibold">This invitation no longer works</h1>
        <p className="text-sm text-ink-soft">
          Invitations work once and expire after 7 days. Ask whoever invited you for a new one, or{" "}
          <Link href="/sign-in">sign in</Link> if you already have an account.
        </p>
      </>
    );
  }
  const { invitation, organization, cohort } = found;
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Create your account</h1>
      <p className="mb-6 text-sm text-ink-soft">
        {organization}
        {cohort ? <> · cohort {cohort}</> : null} · joining as <strong>{invitation.role}</strong>
      </p>
      <ActionForm action={acceptInvite} submitLabel="Create account">
        <input type="hidden" name="token" value={token} />
        <Field label="E-mail" name="email-shown" value={invitation.email} readOnly disabled />
        <Field label="Your name" name="displayName" autoComplete="name" required />
        <Field label="Password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." required />
        <Field label="Repeat the password" name="confirm" type="password" autoComplete="new-password" required />
      </ActionForm>
    </>
  );
}
