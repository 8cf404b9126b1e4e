CREATE TABLE "class_run" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" text NOT NULL,
	"department_id" text,
	"lesson_id" uuid,
	"title" text NOT NULL,
	"class_group" text DEFAULT '' NOT NULL,
	"dice_set_name" text NOT NULL,
	"dice" jsonb NOT NULL,
	"dice_per_player" integer DEFAULT 1 NOT NULL,
	"players" integer DEFAULT 2 NOT NULL,
	"tie_rule" text DEFAULT 're-roll-ties' NOT NULL,
	"matchup_choice" text DEFAULT 'assigned' NOT NULL,
	"phases" jsonb NOT NULL,
	"phase" text NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"join_code" text NOT NULL,
	"current_tally" integer DEFAULT 1 NOT NULL,
	"board_version" bigint DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"closed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "dice_set" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" text NOT NULL,
	"department_id" text,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"visibility" text DEFAULT 'private' NOT NULL,
	"dice" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"duplicated_from_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "guess_vote" (
	"run_id" uuid NOT NULL,
	"group_id" uuid NOT NULL,
	"die_index" integer NOT NULL,
	"voted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lesson" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" text NOT NULL,
	"department_id" text,
	"title" text NOT NULL,
	"class_group" text DEFAULT '' NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"dice_set_id" uuid,
	"plan" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"from_template_id" uuid,
	"from_template_version" integer,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lesson_attachment" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lesson_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"mime_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"storage_key" text NOT NULL,
	"uploaded_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lesson_attachment_storage_key_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
CREATE TABLE "lesson_template" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"department_id" text NOT NULL,
	"title" text NOT NULL,
	"status" text DEFAULT 'published' NOT NULL,
	"current_version" integer DEFAULT 1 NOT NULL,
	"source_lesson_id" uuid,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lesson_template_version" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"change_note" text DEFAULT '' NOT NULL,
	"snapshot" jsonb NOT NULL,
	"published_by_id" text NOT NULL,
	"published_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "paper_import" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"file_hash" text NOT NULL,
	"file_name" text NOT NULL,
	"row_count" integer NOT NULL,
	"imported_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "roll" (
	"id" uuid PRIMARY KEY NOT NULL,
	"run_id" uuid NOT NULL,
	"group_id" uuid NOT NULL,
	"tally" integer DEFAULT 1 NOT NULL,
	"dice_per_player" integer NOT NULL,
	"matchup" jsonb NOT NULL,
	"faces" jsonb NOT NULL,
	"totals" jsonb NOT NULL,
	"winner_seat" integer,
	"source" text DEFAULT 'phone' NOT NULL,
	"paper_import_id" uuid,
	"recorded_at" timestamp with time zone NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"undone_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "run_group" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"nickname" text NOT NULL,
	"matchup" jsonb,
	"source" text DEFAULT 'phone' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shelf_proposal" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"department_id" text NOT NULL,
	"lesson_id" uuid NOT NULL,
	"proposed_by_id" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"decided_by_id" text,
	"decision_note" text,
	"decided_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "class_run" ADD CONSTRAINT "class_run_owner_id_user_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "class_run" ADD CONSTRAINT "class_run_department_id_organization_id_fk" FOREIGN KEY ("department_id") REFERENCES "public"."organization"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "class_run" ADD CONSTRAINT "class_run_lesson_id_lesson_id_fk" FOREIGN KEY ("lesson_id") REFERENCES "public"."lesson"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dice_set" ADD CONSTRAINT "dice_set_owner_id_user_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dice_set" ADD CONSTRAINT "dice_set_department_id_organization_id_fk" FOREIGN KEY ("department_id") REFERENCES "public"."organization"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guess_vote" ADD CONSTRAINT "guess_vote_run_id_class_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."class_run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guess_vote" ADD CONSTRAINT "guess_vote_group_id_run_group_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."run_group"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson" ADD CONSTRAINT "lesson_owner_id_user_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson" ADD CONSTRAINT "lesson_department_id_organization_id_fk" FOREIGN KEY ("department_id") REFERENCES "public"."organization"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson" ADD CONSTRAINT "lesson_dice_set_id_dice_set_id_fk" FOREIGN KEY ("dice_set_id") REFERENCES "public"."dice_set"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_attachment" ADD CONSTRAINT "lesson_attachment_lesson_id_lesson_id_fk" FOREIGN KEY ("lesson_id") REFERENCES "public"."lesson"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_attachment" ADD CONSTRAINT "lesson_attachment_uploaded_by_id_user_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_template" ADD CONSTRAINT "lesson_template_department_id_organization_id_fk" FOREIGN KEY ("department_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_template" ADD CONSTRAINT "lesson_template_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_template_version" ADD CONSTRAINT "lesson_template_version_template_id_lesson_template_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."lesson_template"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_template_version" ADD CONSTRAINT "lesson_template_version_published_by_id_user_id_fk" FOREIGN KEY ("published_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "paper_import" ADD CONSTRAINT "paper_import_run_id_class_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."class_run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "paper_import" ADD CONSTRAINT "paper_import_imported_by_id_user_id_fk" FOREIGN KEY ("imported_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "roll" ADD CONSTRAINT "roll_run_id_class_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."class_run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "roll" ADD CONSTRAINT "roll_group_id_run_group_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."run_group"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "roll" ADD CONSTRAINT "roll_paper_import_id_paper_import_id_fk" FOREIGN KEY ("paper_import_id") REFERENCES "public"."paper_import"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_group" ADD CONSTRAINT "run_group_run_id_class_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."class_run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_proposal" ADD CONSTRAINT "shelf_proposal_department_id_organization_id_fk" FOREIGN KEY ("department_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_proposal" ADD CONSTRAINT "shelf_proposal_proposed_by_id_user_id_fk" FOREIGN KEY ("proposed_by_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_proposal" ADD CONSTRAINT "shelf_proposal_decided_by_id_user_id_fk" FOREIGN KEY ("decided_by_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "class_run_open_join_code_idx" ON "class_run" USING btree ("join_code") WHERE "class_run"."status" <> 'closed';--> statement-breakpoint
CREATE INDEX "class_run_owner_id_idx" ON "class_run" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "class_run_department_id_idx" ON "class_run" USING btree ("department_id");--> statement-breakpoint
CREATE INDEX "dice_set_owner_id_idx" ON "dice_set" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "dice_set_department_visibility_idx" ON "dice_set" USING btree ("department_id","visibility");--> statement-breakpoint
CREATE UNIQUE INDEX "guess_vote_run_group_idx" ON "guess_vote" USING btree ("run_id","group_id");--> statement-breakpoint
CREATE INDEX "lesson_owner_id_idx" ON "lesson" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "lesson_department_id_idx" ON "lesson" USING btree ("department_id");--> statement-breakpoint
CREATE INDEX "lesson_attachment_lesson_id_idx" ON "lesson_attachment" USING btree ("lesson_id");--> statement-breakpoint
CREATE INDEX "lesson_template_department_id_idx" ON "lesson_template" USING btree ("department_id");--> statement-breakpoint
CREATE UNIQUE INDEX "lesson_template_version_template_version_idx" ON "lesson_template_version" USING btree ("template_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "paper_import_run_file_hash_idx" ON "paper_import" USING btree ("run_id","file_hash");--> statement-breakpoint
CREATE INDEX "roll_run_tally_idx" ON "roll" USING btree ("run_id","tally");--> statement-breakpoint
CREATE INDEX "roll_group_id_idx" ON "roll" USING btree ("group_id");--> statement-breakpoint
CREATE UNIQUE INDEX "run_group_run_nickname_idx" ON "run_group" USING btree ("run_id",lower("nickname"));--> statement-breakpoint
CREATE INDEX "shelf_proposal_department_status_idx" ON "shelf_proposal" USING btree ("department_id","status");