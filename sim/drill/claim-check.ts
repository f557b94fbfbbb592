/**
 * Comparison of a browser's claimed score with the server's replay (the official result).
 * Method: absolute tolerances on the score and on each window score; exact equality of the trace
 * fingerprint when one was claimed (the engine is deterministic, so an honest claim matches).
 * Never throws: any input that cannot be read is reported as a mismatch with a reason.
 */

/** What a claim must satisfy to be accepted (stated to instructors as is). */
export const CLAIM_TOLERANCE = {
  /** |claimed − official| total score, points (absolute) */
  score: 0.05,
  /** |claimed − official| of each window score, points (absolute), when the claim carries window scores */
  windowScore: 0.05,
  /** a claimed fingerprint must equal the official one exactly */
  fingerprint: "exact",
  text: "score within 0.05 points; each window score within 0.05 points; the trace fingerprint, when claimed, exactly equal",
} as const;

export type ClaimCheck = { ok: true } | { ok: false; reason: string };

export interface ClaimedResult {
  score: number;
  fingerprint?: string;
  results?: unknown;
}

export interface OfficialClaimBasis {
  score: number;
  fingerprint: string;
  windows: { id: string; score: number }[];
}

function fmt(x: number): string {
  return Number.isFinite(x) ? x.toFixed(1) : String(x);
}

/** A difference, with two decimals when it is below one point (so 0.06 does not read as 0.1). */
function fmtDiff(d: number): string {
  return d < 1 ? d.toFixed(2) : d.toFixed(1);
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

/**
 * Window scores carried by the claimed results, if any: `results.windows[i].score` (numbers, by
 * window id). Plain RunResults carry none (→ "none"); a windows list whose scores cannot be
 * read (→ "unreadable").
 */
function claimedWindowScores(results: unknown): "none" | "unreadable" | Map<string, number> {
  if (results === undefined || results === null) return "none";
  if (!isRecord(results)) return "none";
  const windows = results.windows;
  if (windows === undefined) return "none";
  if (!Array.isArray(windows)) return "unreadable";
  if (!windows.some((w) => isRecord(w) && "score" in w)) return "none";
  const out = new Map<string, number>();
  for (const w of windows) {
    if (!isRecord(w) || typeof w.id !== "string" || typeof w.score !== "number" || !Number.isFinite(w.score)) return "unreadable";
    out.set(w.id, w.score);
  }
  return out;
}

/** Checks a claim against the official replay within CLAIM_TOLERANCE; the reason is for an instructor. */
export function checkClaim(claimed: ClaimedResult, official: OfficialClaimBasis): ClaimCheck {
  try {
    const c = isRecord(claimed) ? claimed : ({} as Partial<ClaimedResult>);
    const cs = typeof c.score === "number" ? c.score : Number.NaN;
    if (!Number.isFinite(cs)) return { ok: false, reason: `Claimed score unreadable; replay ${fmt(official.score)}.` };
    const diff = Math.abs(cs - official.score);
    if (!(diff <= CLAIM_TOLERANCE.score + 1e-9)) {
      return {
        ok: false,
        reason: `Claimed score ${fmt(cs)}, replay ${fmt(official.score)} (differs by ${fmtDiff(diff)} points; tolerance ${CLAIM_TOLERANCE.score}).`,
      };
    }
    if (c.fingerprint !== undefined && c.fingerprint !== official.fingerprint) {
      return { ok: false, reason: `Claimed trace fingerprint ${String(c.fingerprint)} differs from the replay's ${official.fingerprint}.` };
    }
    const ws = claimedWindowScores(c.results);
    if (ws === "unreadable") return { ok: false, reason: "The claimed results are unreadable (their window scores cannot be read)." };
    if (ws !== "none") {
      for (const w of official.windows) {
        const cw = ws.get(w.id);
        if (cw === undefined) return { ok: false, reason: `The claimed results have no score for window "${w.id}".` };
        const d = Math.abs(cw - w.score);
        if (!(d <= CLAIM_TOLERANCE.windowScore + 1e-9)) {
          return {
            ok: false,
            reason: `Window "${w.id}": claimed ${fmt(cw)}, replay ${fmt(w.score)} (differs by ${fmtDiff(d)} points; tolerance ${CLAIM_TOLERANCE.windowScore}).`,
          };
        }
      }
    }
    return { ok: true };
  } catch {
    return { ok: false, reason: "The claim could not be read." };
  }
}
