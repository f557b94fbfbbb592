"use server";
import { redirect } from "next/navigation";
import { z } from "zod";
import { acceptInvitation } from "@/app/_lib/accounts";
import { defineAction } from "@/app/_lib/action";
import { startSession } from "@/app/_lib/auth";
import { displayNameField, newPasswordPair, tokenField } from "@/app/_lib/fields";

const acceptForm = newPasswordPair.and(z.object({ token: tokenField, displayName: displayNameField }));

export const acceptInvite = defineAction(acceptForm, null, async ({ token, displayName, password }) => {
  const userId = await acceptInvitation(token, { displayName, password });
  await startSession(userId);
  redirect("/dashboard?welcome=1");
});
