CREATE TYPE "public"."area_unit" AS ENUM('sqft', 'sqm');--> statement-breakpoint
CREATE TYPE "public"."assignment_status" AS ENUM('in_progress', 'in_review', 'revisions_requested', 'approved', 'signed');--> statement-breakpoint
CREATE TYPE "public"."sale_type" AS ENUM('arms_length', 'distressed', 'family', 'estate', 'new_construction', 'other');--> statement-breakpoint
CREATE TABLE "assignments" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "assignments_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"firm_organisation_id" integer NOT NULL,
	"client_organisation_id" integer NOT NULL,
	"appraiser_user_id" integer NOT NULL,
	"subject_address" text NOT NULL,
	"intended_use" text NOT NULL,
	"loan_reference" text,
	"effective_date" date NOT NULL,
	"due_date" date,
	"area_unit" "area_unit" DEFAULT 'sqft' NOT NULL,
	"currency" text DEFAULT 'USD' NOT NULL,
	"status" "assignment_status" DEFAULT 'in_progress' NOT NULL,
	"time_adjustment" boolean DEFAULT false NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"data_revision" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "import_mappings" (
	"user_id" integer PRIMARY KEY NOT NULL,
	"mapping" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "photos_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"assignment_id" integer NOT NULL,
	"sale_id" integer,
	"storage_key" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"original_name" text NOT NULL,
	"uploaded_by" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"deleted_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "sales" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "sales_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"assignment_id" integer NOT NULL,
	"address" text NOT NULL,
	"lon" double precision,
	"lat" double precision,
	"neighbourhood" text,
	"sale_price" double precision NOT NULL,
	"sale_date" date NOT NULL,
	"floor_area" double precision NOT NULL,
	"lot_size" double precision,
	"bedrooms" integer,
	"bathrooms" double precision,
	"year_built" integer,
	"condition" integer,
	"quality" integer,
	"garage_spaces" integer,
	"sale_type" "sale_type" DEFAULT 'arms_length' NOT NULL,
	"seller_concessions" double precision DEFAULT 0 NOT NULL,
	"data_source" text,
	"verification_note" text,
	"in_grid" boolean DEFAULT false NOT NULL,
	"excluded" boolean DEFAULT false NOT NULL,
	"exclusion_reason" text,
	"cover_photo_id" integer,
	"import_id" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"deleted_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "sales_imports" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "sales_imports_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"assignment_id" integer NOT NULL,
	"user_id" integer NOT NULL,
	"file_name" text NOT NULL,
	"rows_imported" integer NOT NULL,
	"rows_skipped" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "subjects" (
	"assignment_id" integer PRIMARY KEY NOT NULL,
	"lon" double precision,
	"lat" double precision,
	"neighbourhood" text,
	"floor_area" double precision,
	"lot_size" double precision,
	"bedrooms" integer,
	"bathrooms" double precision,
	"year_built" integer,
	"condition" integer,
	"quality" integer,
	"garage_spaces" integer,
	"notes" text,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_firm_organisation_id_organisations_id_fk" FOREIGN KEY ("firm_organisation_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_client_organisation_id_organisations_id_fk" FOREIGN KEY ("client_organisation_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_appraiser_user_id_users_id_fk" FOREIGN KEY ("appraiser_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "import_mappings" ADD CONSTRAINT "import_mappings_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_sale_id_sales_id_fk" FOREIGN KEY ("sale_id") REFERENCES "public"."sales"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales_imports" ADD CONSTRAINT "sales_imports_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales_imports" ADD CONSTRAINT "sales_imports_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subjects" ADD CONSTRAINT "subjects_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "assignments_firm_idx" ON "assignments" USING btree ("firm_organisation_id");--> statement-breakpoint
CREATE INDEX "assignments_client_idx" ON "assignments" USING btree ("client_organisation_id");--> statement-breakpoint
CREATE INDEX "photos_assignment_idx" ON "photos" USING btree ("assignment_id","sale_id");--> statement-breakpoint
CREATE INDEX "sales_assignment_idx" ON "sales" USING btree ("assignment_id","deleted_at");