"use server";
import { z } from "zod";
import { requestPasswordReset } from "@/app/_lib/accounts";
import { defineAction } from "@/app/_lib/action";
import { emailField } from "@/app/_lib/fields";

export const askForReset = defineAction(z.object({ email: emailField }), null, async ({ email }) => {
  await requestPasswordReset(email);
  // The same answer whether or not the address has an account, so it reveals nothing.
  return { ok: true, message: "If that address has an account, a reset link is on its way. It expires in 60 minutes." };
});
