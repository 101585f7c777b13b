CREATE TABLE "company_signups" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_name" text NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"password_hash" text NOT NULL,
	"rule_profile" text NOT NULL,
	"length_unit" text NOT NULL,
	"mass_unit" text NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "company_signups_tokenHash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE INDEX "company_signups_email" ON "company_signups" USING btree ("email");