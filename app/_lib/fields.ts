import { z } from "zod";

// Field rules shared by every form; messages are what the user reads.
export const emailField = z
  .string()
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email("Enter a valid e-mail address."))
  .transform((e) => e.toLowerCase());

export const newPasswordField = z
  .string()
  .min(10, "Use at least 10 characters for the password.")
  .max(200, "Use at most 200 characters for the password.");

export const displayNameField = z.string().trim().min(2, "Enter your name (at least 2 characters).").max(80, "Keep the name under 80 characters.");

export const tokenField = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This link is malformed. Open it again from the e-mail.");

export const uuidField = z.uuid("Unknown item.");

export const timeZoneField = z
  .string()
  .refine((tz) => Intl.supportedValuesOf("timeZone").includes(tz) || tz === "UTC", "Choose a time zone from the list.");

export const newPasswordPair = z
  .object({ password: newPasswordField, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: "The two passwords differ.", path: ["confirm"] });
