CREATE TABLE "data_uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"file_name" text NOT NULL,
	"byte_size" integer NOT NULL,
	"sha256" text NOT NULL,
	"content" "bytea" NOT NULL,
	"mapping" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "data_uploads_sha256_hex" CHECK ("data_uploads"."sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
CREATE TABLE "tuning_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"plant_ref" text NOT NULL,
	"plant_id" uuid,
	"plant_name" text NOT NULL,
	"tuning_set_id" uuid,
	"title" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"document" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"signed_off_by" text,
	"signed_off_on" text,
	"signed_off_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tuning_records_signoff_complete" CHECK (("tuning_records"."signed_off_by" IS NULL) = ("tuning_records"."signed_off_on" IS NULL)),
	CONSTRAINT "tuning_records_signoff_date" CHECK ("tuning_records"."signed_off_on" IS NULL OR "tuning_records"."signed_off_on" ~ '^[0-9]{4}-[0-9]{2}-[0-9]{2}$')
);
--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "source_upload_id" uuid;--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "identification" jsonb;--> statement-breakpoint
ALTER TABLE "data_uploads" ADD CONSTRAINT "data_uploads_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "data_uploads" ADD CONSTRAINT "data_uploads_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_records" ADD CONSTRAINT "tuning_records_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_records" ADD CONSTRAINT "tuning_records_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_records" ADD CONSTRAINT "tuning_records_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_records" ADD CONSTRAINT "tuning_records_tuning_set_id_tuning_sets_id_fk" FOREIGN KEY ("tuning_set_id") REFERENCES "public"."tuning_sets"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "data_uploads_owner_idx" ON "data_uploads" USING btree ("owner_id","created_at");--> statement-breakpoint
CREATE INDEX "tuning_records_org_idx" ON "tuning_records" USING btree ("organization_id","created_at");--> statement-breakpoint
CREATE INDEX "tuning_records_owner_idx" ON "tuning_records" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "tuning_records_plant_idx" ON "tuning_records" USING btree ("plant_ref");--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_source_upload_id_data_uploads_id_fk" FOREIGN KEY ("source_upload_id") REFERENCES "public"."data_uploads"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_twin_has_source" CHECK ("plants"."origin" <> 'twin' OR "plants"."source_upload_id" IS NOT NULL OR "plants"."identification" IS NULL);--> statement-breakpoint
-- An upload is the original file: never changed once written (an identification is redone from it).
CREATE FUNCTION "data_uploads_refuse_update"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'a data upload is kept as uploaded and cannot be changed' USING ERRCODE = 'check_violation';
END $$;--> statement-breakpoint
CREATE TRIGGER "data_uploads_immutable" BEFORE UPDATE ON "data_uploads" FOR EACH ROW EXECUTE FUNCTION "data_uploads_refuse_update"();--> statement-breakpoint
-- A signed-off tuning record is the hand-over document: frozen.
CREATE FUNCTION "tuning_records_refuse_after_signoff"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD."signed_off_by" IS NOT NULL THEN
    RAISE EXCEPTION 'a signed-off tuning record cannot be changed' USING ERRCODE = 'check_violation';
  END IF;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER "tuning_records_frozen_after_signoff" BEFORE UPDATE ON "tuning_records" FOR EACH ROW EXECUTE FUNCTION "tuning_records_refuse_after_signoff"();
