ALTER TABLE "class_run" ADD COLUMN "joining_locked" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "class_run" ADD COLUMN "group_cap" integer DEFAULT 40 NOT NULL;--> statement-breakpoint
ALTER TABLE "class_run" ADD COLUMN "roll_ceiling_reached_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "class_run" ADD COLUMN "last_change_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "run_group" ADD COLUMN "nickname_key" text;--> statement-breakpoint
ALTER TABLE "run_group" ADD COLUMN "join_attempt_id" uuid;--> statement-breakpoint
ALTER TABLE "run_group" ADD COLUMN "removed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "run_group" ADD COLUMN "left_out_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "run_group" ADD COLUMN "flooded_at" timestamp with time zone;--> statement-breakpoint
CREATE UNIQUE INDEX "run_group_run_nickname_key_idx" ON "run_group" USING btree ("run_id","nickname_key");--> statement-breakpoint
CREATE UNIQUE INDEX "run_group_run_join_attempt_idx" ON "run_group" USING btree ("run_id","join_attempt_id");