CREATE TABLE "reading_acceptances" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"profile_id" text NOT NULL,
	"text" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"by_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "companies" ADD COLUMN "number_format" text DEFAULT '1,234.5' NOT NULL;--> statement-breakpoint
ALTER TABLE "company_signups" ADD COLUMN "number_format" text DEFAULT '1,234.5' NOT NULL;--> statement-breakpoint
ALTER TABLE "reading_acceptances" ADD CONSTRAINT "reading_acceptances_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_acceptances" ADD CONSTRAINT "reading_acceptances_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reading_acceptances_company" ON "reading_acceptances" USING btree ("company_id","profile_id");