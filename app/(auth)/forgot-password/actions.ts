"use server";
import { z } from "zod";
import { requestPasswordReset } from "@/app/_lib/accounts";
import { ActionRefused, defineAction } from "@/app/_lib/action";
import { clientAddress } from "@/app/_lib/client-address";
import { emailField } from "@/app/_lib/fields";
import { lockedMinutes, recordFailure, RESET_REQUEST_LIMIT, resetRequestKey } from "@/app/_lib/rate-limit";

export const askForReset = defineAction(z.object({ email: emailField }), null, async ({ email }) => {
  // reset mail is counted per client address, so nobody can flood an inbox from the sign-in page
  const key = resetRequestKey(await clientAddress());
  const wait = await lockedMinutes([key]);
  if (wait > 0) throw new ActionRefused(`Too many reset requests from this address. Try again in ${wait} minute${wait === 1 ? "" : "s"}.`);
  await recordFailure(key, RESET_REQUEST_LIMIT);
  await requestPasswordReset(email);
  // The same answer whether or not the address has an account, so it reveals nothing.
  return { ok: true, message: "If that address has an account, a reset link is on its way. It expires in 60 minutes." };
});
