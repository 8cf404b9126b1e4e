CREATE TABLE "paper_count" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"group_id" uuid NOT NULL,
	"tally" integer DEFAULT 1 NOT NULL,
	"dice_per_player" integer NOT NULL,
	"matchup" jsonb NOT NULL,
	"matchup_key" text NOT NULL,
	"first_wins" integer NOT NULL,
	"ties" integer NOT NULL,
	"second_wins" integer NOT NULL,
	"entered_by_id" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "paper_count" ADD CONSTRAINT "paper_count_run_id_class_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."class_run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "paper_count" ADD CONSTRAINT "paper_count_group_id_run_group_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."run_group"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "paper_count" ADD CONSTRAINT "paper_count_entered_by_id_user_id_fk" FOREIGN KEY ("entered_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "paper_count_run_group_tally_matchup_idx" ON "paper_count" USING btree ("run_id","group_id","tally","matchup_key");--> statement-breakpoint
CREATE INDEX "paper_count_run_id_idx" ON "paper_count" USING btree ("run_id");