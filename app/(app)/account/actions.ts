"use server";
import { z } from "zod";
import { changePassword } from "@/app/_lib/accounts";
import { defineAction } from "@/app/_lib/action";
import { newPasswordPair } from "@/app/_lib/fields";

const changeForm = newPasswordPair.and(z.object({ current: z.string().min(1, "Enter your current password.").max(200) }));

export const changeOwnPassword = defineAction(changeForm, {}, async ({ current, password }, user) => {
  await changePassword(user!.id, current, password);
  return { ok: true, message: "Password changed." };
});
