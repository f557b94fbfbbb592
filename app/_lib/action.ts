// Server actions share one shape: validate the form with zod, authorize with the guard, run the
// handler (which writes in one transaction and revalidates), and answer an ActionResult that
// forms show. Bad input and refusals write nothing.
import { z } from "zod";
import { AccessDenied, authorize, type AccessPolicy } from "./guard";
import type { SignedInUser } from "./auth";

export type ActionResult = { ok: true; message?: string } | { ok: false; error: string; fieldErrors?: Record<string, string> };

export const initialActionResult: ActionResult = { ok: true };

/** A refusal the handler raises for a reason the user can act on (wrong password, used link…). */
export class ActionRefused extends Error {}

export function formToObject(form: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === "string" && !key.startsWith("$")) out[key] = value;
  return out;
}

export function fieldErrorsOf(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join(".") || "form";
    fields[key] ??= issue.message;
  }
  return fields;
}

export function defineAction<S extends z.ZodType>(
  schema: S,
  policy: AccessPolicy | ((input: z.infer<S>) => AccessPolicy) | null,
  handler: (input: z.infer<S>, user: SignedInUser | null) => Promise<ActionResult | void>,
) {
  return async (_previous: ActionResult, form: FormData): Promise<ActionResult> => {
    const parsed = schema.safeParse(formToObject(form));
    if (!parsed.success) {
      const fieldErrors = fieldErrorsOf(parsed.error);
      return { ok: false, error: Object.values(fieldErrors)[0] ?? "Check the form.", fieldErrors };
    }
    try {
      const user = policy === null ? null : await authorize(typeof policy === "function" ? policy(parsed.data) : policy);
      return (await handler(parsed.data, user)) ?? { ok: true };
    } catch (err) {
      if (err instanceof AccessDenied || err instanceof ActionRefused) return { ok: false, error: err.message };
      throw err;
    }
  };
}
