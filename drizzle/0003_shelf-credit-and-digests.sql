CREATE TABLE "proposal_digest" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"department_id" text NOT NULL,
	"head_id" text NOT NULL,
	"digest_day" date NOT NULL,
	"proposal_count" integer NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "lesson_template_version" ADD COLUMN "proposed_by_id" text;--> statement-breakpoint
ALTER TABLE "proposal_digest" ADD CONSTRAINT "proposal_digest_department_id_organization_id_fk" FOREIGN KEY ("department_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_digest" ADD CONSTRAINT "proposal_digest_head_id_user_id_fk" FOREIGN KEY ("head_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "proposal_digest_head_department_day_idx" ON "proposal_digest" USING btree ("head_id","department_id","digest_day");--> statement-breakpoint
ALTER TABLE "lesson_template_version" ADD CONSTRAINT "lesson_template_version_proposed_by_id_user_id_fk" FOREIGN KEY ("proposed_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;