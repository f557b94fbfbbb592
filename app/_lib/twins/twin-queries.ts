/**
 * Reads of twins and their uploads, scoped to what the user may read: a twin is a plant (own, or
 * shared within the organisation: bench-store's readablePlant); an upload is readable by its owner
 * and by whoever may read a twin made from it. Callers authorize first and pass the user.
 */
import { and, desc, eq, exists, or } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb } from "@/db/client";
import { dataUploads, plants, users } from "@/db/schema";
import { logMappingSchema, type LogMapping } from "@/sim/import";
import { transferFunctionParamsSchema, type TransferFunctionParams } from "@/sim/plant/transfer-function-params";
import { ENGINE_VERSION } from "@/sim/version";
import { isUuid, readablePlant, type BenchUser } from "../bench-store";
import { sha256Hex } from "./checksum";
import { decodeLogBytes } from "./decode-log";
import { candidateRecord, readIdentification, type CandidateRecord, type StoredCandidate, type StoredIdentification } from "./identification-record";
import { identifyLog, type LogIdentification } from "./identify-log";

export interface UploadMeta {
  id: string;
  fileName: string;
  byteSize: number;
  sha256: string;
  uploadedAt: string;
  uploadedBy: string;
  summary: Record<string, unknown>;
}

export interface TwinListItem {
  id: string;
  name: string;
  description: string;
  mine: boolean;
  shared: boolean;
  ownerName: string;
  createdAt: string;
  /** the chosen candidate as stored; null when the record cannot be read */
  chosen: StoredCandidate | null;
  upload: UploadMeta;
}

export interface TwinDetail extends TwinListItem {
  definition: TransferFunctionParams | null;
  identification: StoredIdentification | null;
  mapping: Record<string, unknown>;
}

const uploader = alias(users, "uploader");

function baseQuery() {
  return getDb()
    .select({ plant: plants, ownerName: users.displayName, upload: { id: dataUploads.id, fileName: dataUploads.fileName, byteSize: dataUploads.byteSize, sha256: dataUploads.sha256, createdAt: dataUploads.createdAt, summary: dataUploads.summary, mapping: dataUploads.mapping }, uploaderName: uploader.displayName })
    .from(plants)
    .innerJoin(users, eq(users.id, plants.ownerId))
    .innerJoin(dataUploads, eq(dataUploads.id, plants.sourceUploadId))
    .innerJoin(uploader, eq(uploader.id, dataUploads.ownerId));
}

type Row = Awaited<ReturnType<ReturnType<typeof baseQuery>["execute"]>>[number];

function toItem(user: BenchUser, r: Row): TwinDetail {
  const identification = readIdentification(r.plant.identification);
  const def = transferFunctionParamsSchema.safeParse(r.plant.definition);
  const chosen = identification ? (identification.chosen === "sopdt" ? identification.candidates.sopdt : identification.candidates.fopdt) : null;
  return {
    id: r.plant.id,
    name: r.plant.name,
    description: r.plant.description,
    mine: r.plant.ownerId === user.id,
    shared: r.plant.shared,
    ownerName: r.ownerName,
    createdAt: r.plant.createdAt.toISOString(),
    chosen,
    upload: { id: r.upload.id, fileName: r.upload.fileName, byteSize: r.upload.byteSize, sha256: r.upload.sha256, uploadedAt: r.upload.createdAt.toISOString(), uploadedBy: r.uploaderName, summary: r.upload.summary },
    definition: def.success ? def.data : null,
    identification,
    mapping: r.upload.mapping,
  };
}

/** The user's own twins, then those shared within the organisation; newest first in each. */
export async function twinsFor(user: BenchUser): Promise<TwinListItem[]> {
  const rows = await baseQuery().where(and(eq(plants.origin, "twin"), readablePlant(user))).orderBy(desc(plants.createdAt), desc(plants.id));
  const items = rows.map((r) => {
    const { definition: _d, identification: _i, mapping: _m, ...item } = toItem(user, r);
    return item;
  });
  return [...items.filter((t) => t.mine), ...items.filter((t) => !t.mine)];
}

export async function twinDetail(user: BenchUser, plantId: string): Promise<TwinDetail | null> {
  if (!isUuid(plantId)) return null;
  const [row] = await baseQuery().where(and(eq(plants.id, plantId), eq(plants.origin, "twin"), readablePlant(user)));
  return row ? toItem(user, row) : null;
}

/** An upload may be read by its owner and by whoever may read a twin made from it. */
const readableUpload = (user: BenchUser) =>
  or(
    eq(dataUploads.ownerId, user.id),
    exists(
      getDb()
        .select({ one: plants.id })
        .from(plants)
        .where(and(eq(plants.sourceUploadId, dataUploads.id), readablePlant(user))),
    ),
  );

export interface UploadContent {
  id: string;
  fileName: string;
  byteSize: number;
  sha256: string;
  content: Buffer;
}

export async function uploadContent(user: BenchUser, uploadId: string): Promise<UploadContent | null> {
  if (!isUuid(uploadId)) return null;
  const [row] = await getDb()
    .select({ id: dataUploads.id, fileName: dataUploads.fileName, byteSize: dataUploads.byteSize, sha256: dataUploads.sha256, content: dataUploads.content })
    .from(dataUploads)
    .where(and(eq(dataUploads.id, uploadId), readableUpload(user)));
  return row ?? null;
}

export interface Reidentification {
  /** the stored bytes still hash to the stored SHA-256 */
  checksumMatches: boolean;
  /** both candidates came out as stored (to a relative 1e-6: the fit is deterministic on one engine) */
  reproduced: boolean;
  /** what differs, in words (empty when reproduced) */
  differences: string[];
  storedEngineVersion: string | null;
  engineVersion: string;
  /** the fresh run, for plotting the fits against the data; null when the file no longer reads */
  result: LogIdentification | null;
}

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b));

function compareCandidate(label: string, stored: StoredCandidate | null, fresh: CandidateRecord | null): string[] {
  if (!stored && !fresh) return [];
  if (!stored || !fresh) return [`${label}: ${stored ? "no longer fitted" : "fitted now, not stored"}`];
  const out: string[] = [];
  if (!close(stored.gainCPerPercent, fresh.gainCPerPercent)) out.push(`${label} gain K`);
  if (stored.timeConstantsS.length !== fresh.timeConstantsS.length || stored.timeConstantsS.some((t, i) => !close(t, fresh.timeConstantsS[i]))) out.push(`${label} time constant(s)`);
  if (!close(stored.deadTimeS, fresh.deadTimeS)) out.push(`${label} dead time θ`);
  if (!close(stored.quality.r2, fresh.quality.r2)) out.push(`${label} R²`);
  return out;
}

// A fresh identification depends only on the bytes, the mapping and the engine, so a repeated view
// of the same twin reuses it (each costs a second or two of CPU); a few recent ones are kept.
const RECENT_LIMIT = 6;
const recent = new Map<string, LogIdentification>();

function identifyStored(sha256: string, text: string, byteSize: number, mapping: LogMapping): LogIdentification {
  const key = `${ENGINE_VERSION}|${sha256}|${JSON.stringify(mapping)}`;
  const hit = recent.get(key);
  if (hit) {
    recent.delete(key);
    recent.set(key, hit);
    return hit;
  }
  const result = identifyLog(text, byteSize, mapping);
  recent.set(key, result);
  if (recent.size > RECENT_LIMIT) recent.delete(recent.keys().next().value as string);
  return result;
}

/** Runs the identification again from the stored original file and its stored mapping. */
export async function reidentify(user: BenchUser, plantId: string): Promise<Reidentification | null> {
  if (!isUuid(plantId)) return null;
  const [row] = await getDb()
    .select({ identification: plants.identification, sha256: dataUploads.sha256, content: dataUploads.content, mapping: dataUploads.mapping })
    .from(plants)
    .innerJoin(dataUploads, eq(dataUploads.id, plants.sourceUploadId))
    .where(and(eq(plants.id, plantId), eq(plants.origin, "twin"), readablePlant(user)));
  if (!row) return null;
  const stored = readIdentification(row.identification);
  const storedEngineVersion = typeof row.identification?.engineVersion === "string" ? row.identification.engineVersion : null;
  const base = { storedEngineVersion, engineVersion: ENGINE_VERSION };
  const actualSha256 = sha256Hex(row.content);
  const checksumMatches = actualSha256 === row.sha256;
  const mapping = logMappingSchema.safeParse(row.mapping);
  const decoded = decodeLogBytes(row.content);
  if (!mapping.success || !decoded.ok) return { ...base, checksumMatches, reproduced: false, differences: ["the stored file or mapping no longer reads"], result: null };
  // keyed by the hash of the bytes just read, so a changed file is never answered from memory
  const result = identifyStored(actualSha256, decoded.text, row.content.length, mapping.data);
  if (!result.ok) return { ...base, checksumMatches, reproduced: false, differences: [result.message], result };
  const id = result.identification;
  const differences = stored
    ? [...compareCandidate("FOPDT", stored.candidates.fopdt, candidateRecord(id.fopdt)), ...compareCandidate("SOPDT", stored.candidates.sopdt, id.sopdt ? candidateRecord(id.sopdt) : null)]
    : ["the stored identification record is unreadable"];
  return { ...base, checksumMatches, reproduced: checksumMatches && differences.length === 0, differences, result };
}
