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
CREATE INDEX "reading_audit_sweep" ON "reading_audit" USING btree ("sweep_id");--> statement-breakpoint
CREATE INDEX "reading_audit_reading" ON "reading_audit" USING btree ("reading_id");--> statement-breakpoint
CREATE INDEX "readings_sweep_taken" ON "readings" USING btree ("sweep_id","taken_at");--> statement-breakpoint
CREATE INDEX "sweeps_store" ON "sweeps" USING btree ("store_id");--> statement-breakpoint
CREATE INDEX "sweeps_plan" ON "sweeps" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "sweeps_company" ON "sweeps" USING btree ("company_id");