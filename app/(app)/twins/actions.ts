"use server";
// Twins as server actions. acceptTwin reads its FormData itself (defineAction's formToObject keeps
// only strings, and the log arrives as a File): the file's size is checked before a byte is read,
// the other fields are validated with zod, the user must be signed in, and app/_lib/twins does the
// rest in one transaction (it reads and identifies the file again; the browser's fit is not used).
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { ActionRefused, defineAction, type ActionResult } from "@/app/_lib/action";
import { setPlantShared } from "@/app/_lib/bench-store";
import { AccessDenied, authorize } from "@/app/_lib/guard";
import { acceptTwin as accept } from "@/app/_lib/twins/accept-twin";
import { sizeLimitMessage } from "@/app/_lib/twins/upload-limit";
import { MAX_UPLOAD_BYTES } from "@/sim/import";

export type AcceptTwinResult = { ok: true; message: string; id: string } | { ok: false; error: string };

const revalidate = (plantId?: string) => {
  revalidatePath("/twins");
  revalidatePath("/bench");
  if (plantId) revalidatePath(`/twins/${plantId}`);
};

const jsonText = z
  .string({ error: "The column mapping is missing." })
  .max(10_000, "The column mapping is too long.")
  .transform((text, ctx) => {
    try {
      return JSON.parse(text) as unknown;
    } catch {
      ctx.addIssue({ code: "custom", message: "The column mapping is not JSON." });
      return z.NEVER;
    }
  });

const acceptFields = z.object({
  mapping: jsonText,
  choice: z.enum(["fopdt", "sopdt"], { error: "Choose the FOPDT or the SOPDT candidate." }),
  name: z.string({ error: "Give the twin a name." }).max(400, "Keep the twin's name under 120 characters."),
  description: z.string().max(8000, "Keep the description under 4000 characters.").default(""),
  ambientC: z
    .string()
    .max(40)
    .default("")
    .transform((s, ctx) => {
      const t = s.trim().replace(",", ".");
      if (t === "") return null;
      const v = Number(t);
      if (!Number.isFinite(v)) {
        ctx.addIssue({ code: "custom", message: "Ambient must be a number in °C (or left empty)." });
        return z.NEVER;
      }
      return v;
    }),
  shared: z
    .enum(["true", "false", "on"], { error: "Say whether to share the twin." })
    .optional()
    .transform((s) => s === "true" || s === "on"),
});

function stringFields(form: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === "string" && !key.startsWith("$")) out[key] = value;
  return out;
}

export async function acceptTwin(_previous: AcceptTwinResult | null, form: FormData): Promise<AcceptTwinResult> {
  const file = form.get("file");
  if (!file || typeof file === "string") return { ok: false, error: "No file was sent: choose the log file." };
  if (file.size > MAX_UPLOAD_BYTES) return { ok: false, error: sizeLimitMessage(file.size) };
  const parsed = acceptFields.safeParse(stringFields(form));
  if (!parsed.success) return { ok: false, error: parsed.error.issues[0]?.message ?? "Check the form." };
  try {
    const user = await authorize({});
    const bytes = Buffer.from(await file.arrayBuffer());
    const f = parsed.data;
    const { plantId } = await accept(user, { fileName: file.name, bytes, mapping: f.mapping, choice: f.choice, name: f.name, description: f.description, ambientC: f.ambientC, shared: f.shared });
    revalidate(plantId);
    return { ok: true, message: `Twin "${f.name.trim()}" saved.`, id: plantId };
  } catch (err) {
    if (err instanceof AccessDenied || err instanceof ActionRefused) return { ok: false, error: err.message };
    throw err;
  }
}

export const setTwinShared = defineAction(
  z.object({ id: z.uuid("Unknown twin."), shared: z.enum(["true", "false"], { error: "Say whether to share." }).transform((s) => s === "true") }),
  {},
  async ({ id, shared }, user): Promise<ActionResult> => {
    await setPlantShared(user!, id, shared);
    revalidate(id);
    return { ok: true, message: shared ? "Twin shared within your organisation." : "Twin is private again." };
  },
);
