ALTER TABLE "charge_additions" DROP CONSTRAINT "charge_additions_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "chronic_leaker_reports" DROP CONSTRAINT "chronic_leaker_reports_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "compliance_audit" DROP CONSTRAINT "compliance_audit_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "leak_checks" DROP CONSTRAINT "leak_checks_system_id_systems_id_fk";
--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retired_by_id" uuid;--> statement-breakpoint
ALTER TABLE "systems" ADD COLUMN "retire_reason" text;--> statement-breakpoint
ALTER TABLE "systems" ADD CONSTRAINT "systems_retired_by_id_users_id_fk" FOREIGN KEY ("retired_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "charge_additions" ADD CONSTRAINT "charge_additions_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "chronic_leaker_reports" ADD CONSTRAINT "chronic_leaker_reports_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "compliance_audit" ADD CONSTRAINT "compliance_audit_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "leak_checks" ADD CONSTRAINT "leak_checks_system_id_systems_id_fk" FOREIGN KEY ("system_id") REFERENCES "public"."systems"("id") ON DELETE restrict ON UPDATE no action;