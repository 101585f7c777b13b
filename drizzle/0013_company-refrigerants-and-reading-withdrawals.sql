CREATE TABLE "reading_withdrawals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"acceptance_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"by_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "company_refrigerants" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"name" text NOT NULL,
	"name_key" text NOT NULL,
	"safety_class" text NOT NULL,
	"substance_class" text NOT NULL,
	"components" jsonb,
	"stated_gwp" double precision,
	"stated_gwp_basis" text,
	"stated_gwp_source" text,
	"molar_mass" double precision,
	"entered_by_id" uuid NOT NULL,
	"entered_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "reading_withdrawals" ADD CONSTRAINT "reading_withdrawals_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_withdrawals" ADD CONSTRAINT "reading_withdrawals_acceptance_id_reading_acceptances_id_fk" FOREIGN KEY ("acceptance_id") REFERENCES "public"."reading_acceptances"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_withdrawals" ADD CONSTRAINT "reading_withdrawals_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "company_refrigerants" ADD CONSTRAINT "company_refrigerants_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "company_refrigerants" ADD CONSTRAINT "company_refrigerants_entered_by_id_users_id_fk" FOREIGN KEY ("entered_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "reading_withdrawals_acceptance" ON "reading_withdrawals" USING btree ("acceptance_id");--> statement-breakpoint
CREATE UNIQUE INDEX "company_refrigerants_name" ON "company_refrigerants" USING btree ("company_id","name_key");