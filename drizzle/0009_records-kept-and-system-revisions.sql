CREATE TABLE "system_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"system_id" uuid NOT NULL,
	"effective_from" date NOT NULL,
	"kind" text NOT NULL,
	"refrigerant_id" text NOT NULL,
	"full_charge_kg" double precision NOT NULL,
	"appliance_type" text NOT NULL,
	"automatic_leak_detection" boolean NOT NULL,
	"in_service_on" date NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"by_id" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "charge_additions" DROP CONSTRAINT "charge_additions_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "chronic_leaker_reports" DROP CONSTRAINT "chronic_leaker_reports_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "compliance_audit" DROP CONSTRAINT "compliance_audit_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "leak_checks" DROP CONSTRAINT "leak_checks_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "in_service_on" date;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retired_by_id" uuid;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retire_reason" text;--> statement-breakpoint
ALTER TABLE "system_revisions" ADD CONSTRAINT "system_revisions_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "system_revisions" ADD CONSTRAINT "system_revisions_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "system_revisions" ADD CONSTRAINT "system_revisions_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "system_revisions_system" ON "system_revisions" USING btree ("system_id","effective_from");--> statement-breakpoint
ALTER TABLE "systems" ADD CONSTRAINT "systems_retired_by_id_users_id_fk" FOREIGN KEY ("retired_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "chronic_leaker_reports" ADD CONSTRAINT "chronic_leaker_reports_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "compliance_audit" ADD CONSTRAINT "compliance_audit_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_checks" ADD CONSTRAINT "leak_checks_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;