CREATE TYPE "public"."plant_origin" AS ENUM('physical', 'twin');--> statement-breakpoint
CREATE TABLE "plants" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"definition" jsonb NOT NULL,
	"origin" "plant_origin" DEFAULT 'physical' NOT NULL,
	"shared" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "saved_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"plant_ref" text NOT NULL,
	"title" text NOT NULL,
	"drill" jsonb NOT NULL,
	"controller" jsonb NOT NULL,
	"seed" bigint NOT NULL,
	"action_log" jsonb NOT NULL,
	"results" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"duration_s" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tuning_sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"plant_ref" text NOT NULL,
	"name" text NOT NULL,
	"controller" jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "saved_runs" ADD CONSTRAINT "saved_runs_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "saved_runs" ADD CONSTRAINT "saved_runs_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_sets" ADD CONSTRAINT "tuning_sets_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tuning_sets" ADD CONSTRAINT "tuning_sets_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "plants_owner_idx" ON "plants" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "plants_org_shared_idx" ON "plants" USING btree ("organization_id","shared");--> statement-breakpoint
CREATE INDEX "saved_runs_owner_plant_idx" ON "saved_runs" USING btree ("owner_id","plant_ref","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "tuning_sets_owner_plant_name_unique" ON "tuning_sets" USING btree ("owner_id","plant_ref","name");