// Component test (Testing Library in jsdom): a form bound to a server action shows the action's
// refusal as an alert and its success as a status, the contract every Loopwright form keeps.
import { fireEvent, render, screen } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import type { ActionResult } from "@/app/_lib/action";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field } from "@/components/forms/Field";
import { SafetyFooter } from "@/components/shell/SafetyFooter";

describe("ActionForm", () => {
  it("shows a refusal from the action and sends the field values", async () => {
    const action = vi.fn(async (_prev: ActionResult, form: FormData): Promise<ActionResult> => ({ ok: false, error: `No account for ${form.get("email")}.` }));
    render(
      <ActionForm action={action} submitLabel="Send">
        <Field label="E-mail" name="email" defaultValue="ada@example.org" />
      </ActionForm>,
    );
    fireEvent.click(screen.getByRole("button", { name: "Send" }));
    expect((await screen.findByTestId("form-error")).textContent).toBe("No account for ada@example.org.");
    expect(action).toHaveBeenCalledTimes(1);
  });

  it("shows a success message as a status", async () => {
    render(
      <ActionForm action={async () => ({ ok: true, message: "Invitation sent." })} submitLabel="Invite">
        <Field label="E-mail" name="email" />
      </ActionForm>,
    );
    fireEvent.click(screen.getByRole("button", { name: "Invite" }));
    expect((await screen.findByTestId("form-status")).textContent).toBe("Invitation sent.");
  });
});

describe("SafetyFooter", () => {
  it("carries the cutout caution and defers to local codes", () => {
    render(<SafetyFooter />);
    const text = screen.getByRole("contentinfo").textContent ?? "";
    expect(text).toMatch(/independent, manually reset excess-temperature cutout/);
    expect(text).toMatch(/local\s+codes/);
  });
});
