CREATE TYPE "public"."attempt_status" AS ENUM('started', 'submitted', 'verified', 'failed');--> statement-breakpoint
CREATE TYPE "public"."late_rule" AS ENUM('refuse', 'accept-marked', 'accept-penalty');--> statement-breakpoint
CREATE TYPE "public"."standings_visibility" AS ENUM('names', 'initials', 'own-rank');--> statement-breakpoint
CREATE TABLE "assignments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"cohort_id" uuid NOT NULL,
	"drill_version_id" uuid NOT NULL,
	"title" text NOT NULL,
	"opens_at" timestamp with time zone NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"attempt_limit" integer NOT NULL,
	"late_rule" "late_rule" DEFAULT 'accept-marked' NOT NULL,
	"late_penalty_percent" integer DEFAULT 0 NOT NULL,
	"visibility" "standings_visibility" DEFAULT 'initials' NOT NULL,
	"owner_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"open_notice_sent_at" timestamp with time zone,
	"archived_at" timestamp with time zone,
	CONSTRAINT "assignments_due_after_open" CHECK ("assignments"."due_at" > "assignments"."opens_at"),
	CONSTRAINT "assignments_limit_range" CHECK ("assignments"."attempt_limit" between 1 and 50),
	CONSTRAINT "assignments_penalty_range" CHECK ("assignments"."late_penalty_percent" between 0 and 100)
);
--> statement-breakpoint
CREATE TABLE "attempt_feedback" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"attempt_id" uuid NOT NULL,
	"author_id" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "attempts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"assignment_id" uuid NOT NULL,
	"trainee_id" text NOT NULL,
	"drill_version_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"seed" bigint NOT NULL,
	"status" "attempt_status" DEFAULT 'started' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"submitted_at" timestamp with time zone,
	"submission_key" uuid,
	"late" boolean DEFAULT false NOT NULL,
	"controller" jsonb,
	"action_log" jsonb,
	"claimed_score" double precision,
	"claimed_fingerprint" text,
	"claimed_results" jsonb,
	"verified_at" timestamp with time zone,
	"engine_version" text,
	"official_fingerprint" text,
	"official_results" jsonb,
	"official_score_detail" jsonb,
	"score" double precision,
	"raw_score" double precision,
	"settling_time_s" double precision,
	"overshoot_c" double precision,
	"iae" double precision,
	"recovery_time_s" double precision,
	"energy_kwh" double precision,
	"safety_trips" integer,
	"violations" text[],
	"flagged" boolean DEFAULT false NOT NULL,
	"flag_reason" text,
	"failure_reason" text,
	"verify_runs" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "attempts_number_positive" CHECK ("attempts"."number" >= 1)
);
--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_cohort_id_cohorts_id_fk" FOREIGN KEY ("cohort_id") REFERENCES "public"."cohorts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_drill_version_id_drill_versions_id_fk" FOREIGN KEY ("drill_version_id") REFERENCES "public"."drill_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attempt_feedback" ADD CONSTRAINT "attempt_feedback_attempt_id_attempts_id_fk" FOREIGN KEY ("attempt_id") REFERENCES "public"."attempts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attempt_feedback" ADD CONSTRAINT "attempt_feedback_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attempts" ADD CONSTRAINT "attempts_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attempts" ADD CONSTRAINT "attempts_trainee_id_users_id_fk" FOREIGN KEY ("trainee_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attempts" ADD CONSTRAINT "attempts_drill_version_id_drill_versions_id_fk" FOREIGN KEY ("drill_version_id") REFERENCES "public"."drill_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "assignments_cohort_idx" ON "assignments" USING btree ("cohort_id","due_at");--> statement-breakpoint
CREATE INDEX "attempt_feedback_attempt_idx" ON "attempt_feedback" USING btree ("attempt_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "attempts_assignment_trainee_number_unique" ON "attempts" USING btree ("assignment_id","trainee_id","number");--> statement-breakpoint
CREATE INDEX "attempts_standings_idx" ON "attempts" USING btree ("assignment_id","status","score");--> statement-breakpoint
CREATE INDEX "attempts_trainee_idx" ON "attempts" USING btree ("trainee_id","assignment_id");--> statement-breakpoint
-- Hand-written (drizzle-kit does not generate triggers): only a published drill version can be
-- assigned (and a published version is frozen by the trigger of 0002), so every attempt of an
-- assignment ran the same document.
CREATE FUNCTION "assignments_published_version_only"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
	IF NOT EXISTS (SELECT 1 FROM "drill_versions" WHERE "id" = NEW."drill_version_id" AND "status" = 'published') THEN
		RAISE EXCEPTION 'only a published drill version can be assigned'
			USING ERRCODE = 'check_violation', CONSTRAINT = 'assignments_published_version';
	END IF;
	RETURN NEW;
END;
$$;--> statement-breakpoint
CREATE TRIGGER "assignments_published_version_only" BEFORE INSERT OR UPDATE OF "drill_version_id" ON "assignments"
	FOR EACH ROW EXECUTE FUNCTION "assignments_published_version_only"();
