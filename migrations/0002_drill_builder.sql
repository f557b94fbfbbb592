CREATE TYPE "public"."drill_version_status" AS ENUM('draft', 'published');--> statement-breakpoint
CREATE TABLE "drill_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"drill_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"status" "drill_version_status" DEFAULT 'draft' NOT NULL,
	"document" jsonb NOT NULL,
	"published_at" timestamp with time zone,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "drill_versions_version_positive" CHECK ("drill_versions"."version" >= 1),
	CONSTRAINT "drill_versions_published_at" CHECK (("drill_versions"."status" = 'published') = ("drill_versions"."published_at" is not null))
);
--> statement-breakpoint
CREATE TABLE "drills" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"title" text NOT NULL,
	"shared_with_org" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "drill_versions" ADD CONSTRAINT "drill_versions_drill_id_drills_id_fk" FOREIGN KEY ("drill_id") REFERENCES "public"."drills"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drill_versions" ADD CONSTRAINT "drill_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drills" ADD CONSTRAINT "drills_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drills" ADD CONSTRAINT "drills_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "drill_versions_drill_version_unique" ON "drill_versions" USING btree ("drill_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "drill_versions_one_draft" ON "drill_versions" USING btree ("drill_id") WHERE "drill_versions"."status" = 'draft';--> statement-breakpoint
CREATE INDEX "drills_owner_idx" ON "drills" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "drills_org_shared_idx" ON "drills" USING btree ("organization_id","shared_with_org");--> statement-breakpoint
-- Hand-written (drizzle-kit does not generate triggers): a published drill version is frozen.
-- Any UPDATE of a published row, and any DELETE of one, is refused; a draft may be edited,
-- published (draft → published, with published_at) or deleted.
CREATE FUNCTION "drill_versions_freeze_published"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
	IF OLD."status" = 'published' THEN
		RAISE EXCEPTION 'drill version % of drill % is published and cannot be changed', OLD."version", OLD."drill_id"
			USING ERRCODE = 'check_violation', CONSTRAINT = 'drill_versions_published_frozen';
	END IF;
	IF TG_OP = 'DELETE' THEN
		RETURN OLD;
	END IF;
	RETURN NEW;
END;
$$;--> statement-breakpoint
CREATE TRIGGER "drill_versions_freeze_published" BEFORE UPDATE OR DELETE ON "drill_versions"
	FOR EACH ROW EXECUTE FUNCTION "drill_versions_freeze_published"();
