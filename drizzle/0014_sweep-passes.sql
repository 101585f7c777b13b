CREATE TABLE "sweep_passes" (
	"id" uuid PRIMARY KEY NOT NULL,
	"sweep_id" uuid NOT NULL,
	"fans" text NOT NULL,
	"defrost" boolean NOT NULL,
	"fixture_id" uuid,
	"started_at" timestamp (3) with time zone NOT NULL,
	"ended_at" timestamp (3) with time zone,
	"started_by_id" uuid,
	"received_at" timestamp (3) with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "readings" ADD COLUMN "pass_id" uuid;--> statement-breakpoint
ALTER TABLE "sweep_passes" ADD CONSTRAINT "sweep_passes_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweep_passes" ADD CONSTRAINT "sweep_passes_started_by_id_users_id_fk" FOREIGN KEY ("started_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sweep_passes_sweep" ON "sweep_passes" USING btree ("sweep_id","started_at");--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_pass_id_sweep_passes_id_fk" FOREIGN KEY ("pass_id") REFERENCES "public"."sweep_passes"("id") ON DELETE no action ON UPDATE no action;