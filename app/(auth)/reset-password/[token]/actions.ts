"use server";
import { redirect } from "next/navigation";
import { z } from "zod";
import { resetPassword } from "@/app/_lib/accounts";
import { defineAction } from "@/app/_lib/action";
import { newPasswordPair, tokenField } from "@/app/_lib/fields";

export const chooseNewPassword = defineAction(newPasswordPair.and(z.object({ token: tokenField })), null, async ({ token, password }) => {
  await resetPassword(token, password);
  redirect("/sign-in?reset=1");
});
