/**
 * Accepting a twin: the uploaded bump-test log becomes a data_uploads row (the exact bytes and
 * their SHA-256) and a plant of origin "twin" built from the chosen fit, in one transaction.
 * Independent of Next (the server action and the integration tests call it).
 *
 * The server reads the bytes itself and identifies the model again: nothing the browser computed
 * is used, only its choices (mapping, candidate, name, ambient, sharing). Every refusal is an
 * ActionRefused raised before the transaction opens, so bad input writes no row at all.
 */
import { z } from "zod";
import { getDb } from "@/db/client";
import { dataUploads, plants } from "@/db/schema";
import { logMappingSchema, MAX_UPLOAD_BYTES } from "@/sim/import";
import { ActionRefused } from "../action";
import { firstIssue, newPlantValues, plantInputSchema, type BenchUser } from "../bench-store";
import { sha256Hex } from "./checksum";
import { decodeLogBytes } from "./decode-log";
import { identificationRecord } from "./identification-record";
import { identifyLog } from "./identify-log";
import { twinDefinition, type CandidateKind } from "./twin-definition";
import { sizeLimitMessage } from "./upload-limit";

export interface AcceptTwinInput {
  fileName: string;
  bytes: Buffer;
  /** a LogMapping (validated here) */
  mapping: unknown;
  choice: CandidateKind;
  name: string;
  description?: string;
  /** ambient during the test, °C; omitted: the PV before the step */
  ambientC?: number | null;
  shared?: boolean;
}

// PostgreSQL text and jsonb hold neither NUL nor lone UTF-16 surrogates: what a person typed is
// kept readable rather than refused (a lone surrogate becomes U+FFFD, as a browser would send it).
const loneSurrogate = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g;
const storable = (s: string, keepLines: boolean) => s.replace(loneSurrogate, "\ufffd").replace(keepLines ? /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g : /[\u0000-\u001f\u007f]/g, "");

// What a file name may carry into a download header: no path, no control characters.
function cleanFileName(raw: string): string {
  const base = raw.split(/[\\/]/).pop() ?? "";
  return storable(base, false).trim();
}

const fieldsSchema = z.object({
  fileName: z
    .string({ error: "The file has no name." })
    .transform(cleanFileName)
    .pipe(z.string().min(1, "The file has no name.").max(255, "Keep the file name under 255 characters.")),
  mapping: z.unknown().transform((value, ctx) => {
    const r = logMappingSchema.safeParse(value);
    if (!r.success) {
      ctx.addIssue({ code: "custom", message: `The column mapping is not valid — ${firstIssue(r.error)}` });
      return z.NEVER;
    }
    return r.data;
  }),
  choice: z.enum(["fopdt", "sopdt"], { error: "Choose the FOPDT or the SOPDT candidate." }),
  ambientC: z
    .number({ error: "Ambient must be a number in °C." })
    .finite("Ambient must be a number in °C.")
    .min(-60, "Ambient must lie between −60 and 150 °C.")
    .max(150, "Ambient must lie between −60 and 150 °C.")
    .nullable()
    .default(null),
  name: z
    .string({ error: "Give the twin a name." })
    .transform((v) => storable(v, false))
    .pipe(z.string().trim().min(1, "Give the twin a name.").max(120, "Keep the twin's name under 120 characters.")),
  description: z
    .string()
    .default("")
    .transform((v) => storable(v, true))
    .pipe(z.string().trim().max(4000, "Keep the description under 4000 characters.")),
  shared: z.boolean().default(false),
});

export async function acceptTwin(user: BenchUser, input: AcceptTwinInput): Promise<{ plantId: string; uploadId: string }> {
  // size first: nothing of an oversized file is looked at
  const bytes = input.bytes;
  if (!(bytes instanceof Uint8Array)) throw new ActionRefused("No file was sent: choose the log file.");
  if (bytes.length > MAX_UPLOAD_BYTES) throw new ActionRefused(sizeLimitMessage(bytes.length));
  if (bytes.length === 0) throw new ActionRefused("The file is empty: choose the CSV or TSV file the logger wrote.");

  const fields = fieldsSchema.safeParse({ ...input, bytes: undefined });
  if (!fields.success) throw new ActionRefused(fields.error.issues[0]?.message ?? "Check the form.");
  const { fileName, mapping, choice, ambientC, shared, name, description } = fields.data;

  const decoded = decodeLogBytes(bytes);
  if (!decoded.ok) throw new ActionRefused(decoded.message);
  const result = identifyLog(decoded.text, bytes.length, mapping);
  if (!result.ok) throw new ActionRefused(result.message);
  const { identification, summary } = result;

  const fit = choice === "sopdt" ? identification.sopdt : identification.fopdt;
  if (!fit) throw new ActionRefused("There is no SOPDT fit for this log: accept the FOPDT candidate.");
  // a heater loop's PV rises with OUT; a falling response is an inverted OUT column or a cooling loop
  if (!(fit.model.gainCPerPercent > 0))
    throw new ActionRefused("PV falls when OUT rises in this log (a negative gain): check that the OUT column is not inverted; a cooling loop cannot be a heater twin.");

  let definition;
  try {
    // the fitted baseline, not the mean PV before the step: the twin then starts where the accepted fit does
    definition = twinDefinition(fit.model, { outBeforePercent: identification.step.outBefore, pvBeforeC: Number.isFinite(fit.baselineC) ? fit.baselineC : identification.step.pvBefore }, { name, ambientC });
  } catch {
    throw new ActionRefused(`The ${choice.toUpperCase()} fit does not make a usable plant (a time constant or the gain is not a finite positive figure): try the other candidate or another log.`);
  }
  // the Bench's own plant rules (name, description, the engine's plant schema)
  const plant = plantInputSchema.safeParse({ name, description, origin: "twin", definition });
  if (!plant.success) throw new ActionRefused(plant.error.issues[0]?.message ?? "Check the form.");
  const p = plant.data;
  const record = identificationRecord(identification, summary, mapping, { chosen: choice, encoding: decoded.encoding, ambientC, fitNote: result.fitNote });

  return getDb().transaction(async (tx) => {
    const [upload] = await tx
      .insert(dataUploads)
      .values({
        organizationId: user.organizationId,
        ownerId: user.id,
        fileName,
        byteSize: bytes.length,
        sha256: sha256Hex(bytes),
        content: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length),
        mapping: mapping as unknown as Record<string, unknown>,
        summary: { ...summary, encoding: decoded.encoding } as unknown as Record<string, unknown>,
      })
      .returning({ id: dataUploads.id });
    const [row] = await tx
      .insert(plants)
      .values({
        ...newPlantValues(user, p),
        origin: "twin",
        shared,
        sourceUploadId: upload.id,
        identification: record as unknown as Record<string, unknown>,
      })
      .returning({ id: plants.id });
    return { plantId: row.id, uploadId: upload.id };
  });
}
