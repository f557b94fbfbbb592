"use server";
import { redirect } from "next/navigation";
import { z } from "zod";
import { checkSignIn } from "@/app/_lib/accounts";
import { defineAction } from "@/app/_lib/action";
import { startSession } from "@/app/_lib/auth";
import { clientAddress } from "@/app/_lib/client-address";
import { emailField } from "@/app/_lib/fields";

const signInForm = z.object({ email: emailField, password: z.string().min(1, "Enter your password.").max(200) });

export const signIn = defineAction(signInForm, null, async ({ email, password }) => {
  const userId = await checkSignIn(email, password, await clientAddress());
  await startSession(userId);
  redirect("/dashboard");
});
