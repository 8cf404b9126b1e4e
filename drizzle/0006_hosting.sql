CREATE TABLE "rate_limit" (
	"key" varchar(255) PRIMARY KEY NOT NULL,
	"points" integer DEFAULT 0 NOT NULL,
	"expire" bigint
);
--> statement-breakpoint
CREATE TABLE "set_finder_search" (
	"id" uuid PRIMARY KEY NOT NULL,
	"owner_id" text NOT NULL,
	"status" text NOT NULL,
	"request" jsonb NOT NULL,
	"mode" text,
	"progress" jsonb NOT NULL,
	"results" jsonb NOT NULL,
	"complete" boolean DEFAULT false NOT NULL,
	"message" text,
	"cancel_requested" boolean DEFAULT false NOT NULL,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "socket_io_attachments" (
	"id" bigserial NOT NULL,
	"created_at" timestamp with time zone DEFAULT now(),
	"payload" "bytea",
	CONSTRAINT "socket_io_attachments_id_unique" UNIQUE("id")
);
--> statement-breakpoint
ALTER TABLE "set_finder_search" ADD CONSTRAINT "set_finder_search_owner_id_user_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "set_finder_search_owner_started_idx" ON "set_finder_search" USING btree ("owner_id","started_at");