// The upload's fingerprint: lowercase hex SHA-256 over the exact bytes (data_uploads.sha256).
import { createHash } from "node:crypto";

export const sha256Hex = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");
