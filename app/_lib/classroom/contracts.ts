// The classroom's shapes shared by server and client: what a trainee's Bench submits for an
// attempt, and what the attempt and standings route handlers answer. Types and zod schemas only:
// no database, no Next, so client components import this file freely.
import { z } from "zod";
import { controllerConfigSchema } from "@/sim/control/config";
import { actionLogSchema } from "@/sim/drill/actions";

/** The most actions one attempt may log (a 12 h drill at one action a second stays far below). */
export const MAX_ATTEMPT_ACTIONS = 20_000;

/**
 * One submission of an attempt. The attempt id was issued by the server when the attempt started;
 * `submissionKey` is made once by the page that runs the attempt (kept across reloads), so a retry
 * of the same submission is recognised and answered again instead of being refused.
 * Only the inputs are trusted (after validation); `claimed` is compared with the server's replay.
 */
export const attemptSubmissionSchema = z
  .object({
    attemptId: z.string().uuid("That is not an attempt id."),
    submissionKey: z.string().uuid("The submission key must be a UUID."),
    /** the controller configuration at the start of the run */
    controller: controllerConfigSchema,
    actionLog: actionLogSchema.max(MAX_ATTEMPT_ACTIONS, `An attempt may log at most ${MAX_ATTEMPT_ACTIONS} actions.`),
    claimed: z
      .object({
        score: z.number().finite(),
        /** traceFingerprint of the streamed trace (sim/drill/trace-hash.ts) */
        fingerprint: z.string().regex(/^[0-9a-f]{16}$/).optional(),
        /** the RunResults the browser computed (sim/drill/results.ts); a claim, never stored as official */
        results: z.record(z.string(), z.unknown()),
      })
      .strict(),
  })
  .strict();
export type AttemptSubmission = z.input<typeof attemptSubmissionSchema>;

export type AttemptStatus = "started" | "verifying" | "verified" | "failed";

/** The measures standings rank on, from the official (replayed) results (defined in sim). */
export type { AttemptSummary } from "@/sim/drill/summary";
import type { AttemptSummary } from "@/sim/drill/summary";

/** Automatic feedback on one scoring window (sim/drill/feedback.ts makes it). */
export type { WindowFeedback } from "@/sim/drill/feedback";
import type { WindowFeedback } from "@/sim/drill/feedback";

export interface AttemptFeedbackNote {
  id: string;
  authorName: string;
  body: string;
  createdAt: string;
}

/** GET /api/attempts/[attemptId] */
export interface AttemptDetail {
  id: string;
  number: number;
  status: AttemptStatus;
  startedAt: string;
  submittedAt: string | null;
  verifiedAt: string | null;
  late: boolean;
  assignment: { id: string; title: string; cohortId: string; dueAt: string; timeZone: string; attemptLimit: number };
  trainee: { id: string; name: string };
  /** the drill version the attempt ran (sim/drill/schema.ts, parsed) */
  drill: Record<string, unknown>;
  drillVersion: number;
  seed: number;
  /** null until submitted */
  controller: Record<string, unknown> | null;
  actionLog: unknown[] | null;
  official: {
    engineVersion: string;
    fingerprint: string;
    summary: AttemptSummary;
    windows: WindowFeedback[];
    /** settings or operations outside the drill's rules, found by the replay */
    violations: string[];
  } | null;
  /** the client's claim disagreed with the replay beyond CLAIM_TOLERANCE */
  flagged: boolean;
  flagReason: string | null;
  /** the viewer may leave written feedback (instructors of the cohort, admins) */
  canReview: boolean;
  feedback: AttemptFeedbackNote[];
}

export type StandingsVisibility = "names" | "initials" | "own-rank";

export interface StandingsRow {
  rank: number;
  /** null when the viewer may not open it (another trainee's attempt) */
  attemptId: string | null;
  traineeLabel: string;
  isViewer: boolean;
  attemptNumber: number;
  attemptsUsed: number;
  submittedAt: string;
  late: boolean;
  /** shown to staff only (always false for trainees) */
  flagged: boolean;
  summary: AttemptSummary;
}

/** GET /api/assignments/[assignmentId]/standings?view=best|all */
export interface StandingsResponse {
  assignment: {
    id: string;
    title: string;
    visibility: StandingsVisibility;
    dueAt: string;
    attemptLimit: number;
    timeZone: string;
    /** which kinds of scoring window the drill has (settling / recovery columns mean nothing without them) */
    windowKinds: { setpoint: boolean; disturbance: boolean };
  };
  viewer: { staff: boolean };
  view: "best" | "all";
  /** trainees ranked (best view) */
  rankedTrainees: number;
  /** attempts still being verified (not in rows yet) */
  verifying: number;
  rows: StandingsRow[];
  generatedAt: string;
}
