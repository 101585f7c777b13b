CREATE TABLE "reading_audit" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"sweep_id" uuid NOT NULL,
	"reading_id" uuid NOT NULL,
	"action" text NOT NULL,
	"before" jsonb NOT NULL,
	"after" jsonb,
	"by_id" uuid,
	"edited_at" timestamp (3) with time zone,
	"received_at" timestamp (3) with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "readings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"sweep_id" uuid NOT NULL,
	"x" double precision NOT NULL,
	"y" double precision NOT NULL,
	"taken_at" timestamp (3) with time zone NOT NULL,
	"ppm" double precision NOT NULL,
	"at_least" boolean DEFAULT false NOT NULL,
	"sample_point" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"recorded_by_id" uuid,
	"received_at" timestamp (3) with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp (3) with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sweeps" (
	"id" uuid PRIMARY KEY NOT NULL,
	"company_id" uuid NOT NULL,
	"store_id" uuid NOT NULL,
	"plan_id" uuid NOT NULL,
	"detector_id" uuid NOT NULL,
	"technician_id" uuid NOT NULL,
	"system_ids" uuid[] DEFAULT '{}' NOT NULL,
	"fans" text NOT NULL,
	"defrost" boolean NOT NULL,
	"status" text DEFAULT 'in-progress' NOT NULL,
	"transport_delay_s" double precision NOT NULL,
	"time_constant_s" double precision NOT NULL,
	"alarm_ppm" double precision NOT NULL,
	"warnings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"submitted_at" timestamp with time zone,
	"reviewed_at" timestamp with time zone,
	"reviewed_by_id" uuid,
	"readings_revision" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "analyses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"sweep_id" uuid NOT NULL,
	"params_key" text NOT NULL,
	"params" jsonb NOT NULL,
	"readings_revision" integer NOT NULL,
	"result" jsonb NOT NULL,
	"field_width" integer NOT NULL,
	"field_height" integer NOT NULL,
	"cell_size" double precision NOT NULL,
	"field_values" "bytea" NOT NULL,
	"field_confidence" "bytea" NOT NULL,
	"duration_ms" integer NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "finding_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"finding_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"status" text NOT NULL,
	"on" date NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"by_id" uuid NOT NULL,
	"result" text,
	"note" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "finding_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"finding_id" uuid NOT NULL,
	"company_id" uuid NOT NULL,
	"key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"mime" text NOT NULL,
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL,
	"by_id" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"store_id" uuid NOT NULL,
	"system_id" uuid,
	"plan_id" uuid,
	"sweep_id" uuid,
	"fixture_id" uuid,
	"x" double precision,
	"y" double precision,
	"component" text,
	"source" text NOT NULL,
	"status" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"dismiss_reason" text,
	"found_at" timestamp with time zone NOT NULL,
	"found_by_id" uuid NOT NULL,
	"client_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "charge_additions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"system_id" uuid NOT NULL,
	"added_on" date NOT NULL,
	"amount_kg" double precision NOT NULL,
	"entered_value" double precision NOT NULL,
	"entered_unit" text NOT NULL,
	"technician_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"excluded" text,
	"finding_id" uuid,
	"corrects_id" uuid,
	"recorded_by_id" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"voided_at" timestamp with time zone,
	"voided_by_id" uuid,
	"void_reason" text
);
--> statement-breakpoint
CREATE TABLE "digest_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"local_date" date NOT NULL,
	"status" text NOT NULL,
	"trigger" text NOT NULL,
	"recipients" text[] DEFAULT '{}' NOT NULL,
	"item_count" integer DEFAULT 0 NOT NULL,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "leak_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"system_id" uuid NOT NULL,
	"checked_on" date NOT NULL,
	"leak_found" boolean NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"by_id" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "report_sends" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"sweep_id" uuid NOT NULL,
	"sent_by_id" uuid,
	"recipients" text[] NOT NULL,
	"subject" text NOT NULL,
	"filename" text NOT NULL,
	"bytes" integer NOT NULL,
	"readings_revision" integer NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "reading_audit" ADD CONSTRAINT "reading_audit_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_audit" ADD CONSTRAINT "reading_audit_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_store_id_stores_id_fk" FOREIGN KEY ("store_id") REFERENCES "public"."stores"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_detector_id_detectors_id_fk" FOREIGN KEY ("detector_id") REFERENCES "public"."detectors"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_reviewed_by_id_users_id_fk" FOREIGN KEY ("reviewed_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_events" ADD CONSTRAINT "finding_events_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_events" ADD CONSTRAINT "finding_events_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD CONSTRAINT "finding_photos_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD CONSTRAINT "finding_photos_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD CONSTRAINT "finding_photos_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_store_id_stores_id_fk" FOREIGN KEY ("store_id") REFERENCES "public"."stores"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_found_by_id_users_id_fk" FOREIGN KEY ("found_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_voided_by_id_users_id_fk" FOREIGN KEY ("voided_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "digest_runs" ADD CONSTRAINT "digest_runs_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_checks" ADD CONSTRAINT "leak_checks_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_checks" ADD CONSTRAINT "leak_checks_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_checks" ADD CONSTRAINT "leak_checks_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_sends" ADD CONSTRAINT "report_sends_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_sends" ADD CONSTRAINT "report_sends_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_sends" ADD CONSTRAINT "report_sends_sent_by_id_users_id_fk" FOREIGN KEY ("sent_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reading_audit_sweep" ON "reading_audit" USING btree ("sweep_id");--> statement-breakpoint
CREATE INDEX "reading_audit_reading" ON "reading_audit" USING btree ("reading_id");--> statement-breakpoint
CREATE INDEX "readings_sweep_taken" ON "readings" USING btree ("sweep_id","taken_at");--> statement-breakpoint
CREATE INDEX "sweeps_store" ON "sweeps" USING btree ("store_id");--> statement-breakpoint
CREATE INDEX "sweeps_plan" ON "sweeps" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "sweeps_company" ON "sweeps" USING btree ("company_id");--> statement-breakpoint
CREATE UNIQUE INDEX "analyses_sweep_params" ON "analyses" USING btree ("sweep_id","params_key");--> statement-breakpoint
CREATE INDEX "analyses_company" ON "analyses" USING btree ("company_id");--> statement-breakpoint
CREATE INDEX "finding_events_finding" ON "finding_events" USING btree ("finding_id");--> statement-breakpoint
CREATE INDEX "finding_photos_finding" ON "finding_photos" USING btree ("finding_id");--> statement-breakpoint
CREATE INDEX "findings_store" ON "findings" USING btree ("store_id");--> statement-breakpoint
CREATE INDEX "findings_system" ON "findings" USING btree ("system_id");--> statement-breakpoint
CREATE UNIQUE INDEX "findings_company_client" ON "findings" USING btree ("company_id","client_id");--> statement-breakpoint
CREATE INDEX "charge_additions_system" ON "charge_additions" USING btree ("system_id");--> statement-breakpoint
CREATE UNIQUE INDEX "digest_runs_company_date" ON "digest_runs" USING btree ("company_id","local_date");--> statement-breakpoint
CREATE INDEX "leak_checks_system" ON "leak_checks" USING btree ("system_id");--> statement-breakpoint
CREATE INDEX "report_sends_sweep" ON "report_sends" USING btree ("sweep_id");--> statement-breakpoint
CREATE INDEX "report_sends_company" ON "report_sends" USING btree ("company_id");