// Form field rules: what the server accepts before anything is written.
import { describe, expect, it } from "vitest";
import { emailField, newPasswordPair, timeZoneField, tokenField } from "@/app/_lib/fields";

describe("form fields", () => {
  it("normalises e-mail and refuses malformed addresses", () => {
    expect(emailField.parse("  Ada@Example.ORG ")).toBe("ada@example.org");
    for (const bad of ["", "no-at-sign", "a@", "@b.c", "a b@c.d"]) expect(emailField.safeParse(bad).success).toBe(false);
  });
  it("requires matching passwords of at least 10 characters", () => {
    expect(newPasswordPair.safeParse({ password: "short", confirm: "short" }).success).toBe(false);
    const mismatch = newPasswordPair.safeParse({ password: "long enough 1", confirm: "long enough 2" });
    expect(mismatch.success).toBe(false);
    expect(mismatch.error?.issues[0].message).toBe("The two passwords differ.");
    expect(newPasswordPair.safeParse({ password: "long enough 1", confirm: "long enough 1" }).success).toBe(true);
  });
  it("accepts only IANA time zones and well-formed link tokens", () => {
    expect(timeZoneField.safeParse("Europe/Dublin").success).toBe(true);
    expect(timeZoneField.safeParse("Mars/Olympus").success).toBe(false);
    expect(tokenField.safeParse("x".repeat(43)).success).toBe(true);
    expect(tokenField.safeParse("../../etc/passwd").success).toBe(false);
  });
});
