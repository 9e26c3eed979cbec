CREATE TYPE "public"."query_message_kind" AS ENUM('question', 'comment', 'kept', 'excluded', 'resolved', 'reopened');--> statement-breakpoint
CREATE TYPE "public"."query_status" AS ENUM('open', 'answered', 'resolved');--> statement-breakpoint
CREATE TABLE "firm_settings" (
	"organisation_id" integer PRIMARY KEY NOT NULL,
	"net_limit_pct" double precision DEFAULT 15 NOT NULL,
	"gross_limit_pct" double precision DEFAULT 25 NOT NULL,
	"max_sale_age_months" integer DEFAULT 12 NOT NULL,
	"max_distance_km" double precision DEFAULT 1.609344 NOT NULL,
	"check_bracketing" boolean DEFAULT true NOT NULL,
	"version" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "grid_entries" (
	"sale_id" integer PRIMARY KEY NOT NULL,
	"assignment_id" integer NOT NULL,
	"line_items" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"weight_pct" double precision,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "grid_settings" (
	"assignment_id" integer PRIMARY KEY NOT NULL,
	"typed_rate" double precision,
	"rate_justification" text,
	"rate_increment" double precision DEFAULT 1 NOT NULL,
	"value_increment" double precision DEFAULT 1000 NOT NULL,
	"reconciliation_comment" text,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "query_messages" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "query_messages_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"query_id" integer NOT NULL,
	"author_id" integer NOT NULL,
	"kind" "query_message_kind" NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_queries" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "review_queries_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"assignment_id" integer NOT NULL,
	"sale_id" integer,
	"raised_by" integer NOT NULL,
	"status" "query_status" DEFAULT 'open' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "status_changes" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "status_changes_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"assignment_id" integer NOT NULL,
	"from_status" "assignment_status",
	"to_status" "assignment_status" NOT NULL,
	"by_user_id" integer NOT NULL,
	"note" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "firm_settings" ADD CONSTRAINT "firm_settings_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "grid_entries" ADD CONSTRAINT "grid_entries_sale_id_sales_id_fk" FOREIGN KEY ("sale_id") REFERENCES "public"."sales"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "grid_entries" ADD CONSTRAINT "grid_entries_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "grid_settings" ADD CONSTRAINT "grid_settings_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "query_messages" ADD CONSTRAINT "query_messages_query_id_review_queries_id_fk" FOREIGN KEY ("query_id") REFERENCES "public"."review_queries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "query_messages" ADD CONSTRAINT "query_messages_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_queries" ADD CONSTRAINT "review_queries_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_queries" ADD CONSTRAINT "review_queries_sale_id_sales_id_fk" FOREIGN KEY ("sale_id") REFERENCES "public"."sales"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_queries" ADD CONSTRAINT "review_queries_raised_by_users_id_fk" FOREIGN KEY ("raised_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "status_changes" ADD CONSTRAINT "status_changes_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "status_changes" ADD CONSTRAINT "status_changes_by_user_id_users_id_fk" FOREIGN KEY ("by_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "query_messages_query_idx" ON "query_messages" USING btree ("query_id");--> statement-breakpoint
CREATE INDEX "review_queries_assignment_idx" ON "review_queries" USING btree ("assignment_id","status");--> statement-breakpoint
CREATE INDEX "status_changes_assignment_idx" ON "status_changes" USING btree ("assignment_id");