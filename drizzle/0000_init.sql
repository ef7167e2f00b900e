CREATE SEQUENCE "public"."change_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1;--> statement-breakpoint
CREATE TABLE "organisations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"slug" text NOT NULL,
	"address_lines" text DEFAULT '' NOT NULL,
	"phone" text DEFAULT '' NOT NULL,
	"email" text DEFAULT '' NOT NULL,
	"currency" text DEFAULT 'GBP' NOT NULL,
	"tax_rate_basis_points" integer DEFAULT 2000 NOT NULL,
	"labour_rate_minor_per_hour" integer DEFAULT 6000 NOT NULL,
	"distance_unit" text DEFAULT '[mi_i]' NOT NULL,
	"time_zone" text DEFAULT 'Europe/London' NOT NULL,
	"workday_start_minute" integer DEFAULT 480 NOT NULL,
	"workday_end_minute" integer DEFAULT 1080 NOT NULL,
	"reminder_lead_days" integer DEFAULT 21 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "organisations_slug_unique" UNIQUE("slug"),
	CONSTRAINT "organisations_currency_check" CHECK ("organisations"."currency" ~ '^[A-Z]{3}$'),
	CONSTRAINT "organisations_tax_check" CHECK ("organisations"."tax_rate_basis_points" between 0 and 10000),
	CONSTRAINT "organisations_labour_check" CHECK ("organisations"."labour_rate_minor_per_hour" >= 0),
	CONSTRAINT "organisations_distance_unit_check" CHECK ("organisations"."distance_unit" in ('km', '[mi_i]')),
	CONSTRAINT "organisations_workday_check" CHECK ("organisations"."workday_start_minute" >= 0 and "organisations"."workday_end_minute" <= 1440 and "organisations"."workday_start_minute" < "organisations"."workday_end_minute")
);
--> statement-breakpoint
CREATE TABLE "account" (
	"id" text PRIMARY KEY NOT NULL,
	"account_id" text NOT NULL,
	"provider_id" text NOT NULL,
	"user_id" text NOT NULL,
	"access_token" text,
	"refresh_token" text,
	"id_token" text,
	"access_token_expires_at" timestamp with time zone,
	"refresh_token_expires_at" timestamp with time zone,
	"scope" text,
	"password" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_limit" (
	"id" text PRIMARY KEY NOT NULL,
	"key" text NOT NULL,
	"count" integer NOT NULL,
	"last_request" bigint NOT NULL,
	CONSTRAINT "rate_limit_key_unique" UNIQUE("key")
);
--> statement-breakpoint
CREATE TABLE "session" (
	"id" text PRIMARY KEY NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"token" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"ip_address" text,
	"user_agent" text,
	"user_id" text NOT NULL,
	CONSTRAINT "session_token_unique" UNIQUE("token")
);
--> statement-breakpoint
CREATE TABLE "user" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"email_verified" boolean DEFAULT false NOT NULL,
	"image" text,
	"role" text DEFAULT 'technician' NOT NULL,
	"organisation_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "user_email_unique" UNIQUE("email"),
	CONSTRAINT "user_role_check" CHECK ("user"."role" in ('owner', 'office', 'technician'))
);
--> statement-breakpoint
CREATE TABLE "verification" (
	"id" text PRIMARY KEY NOT NULL,
	"identifier" text NOT NULL,
	"value" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "customers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"name" text NOT NULL,
	"email" text,
	"phone" text,
	"address_lines" text DEFAULT '' NOT NULL,
	"postcode" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "customers_name_check" CHECK (length(trim("customers"."name")) > 0)
);
--> statement-breakpoint
CREATE TABLE "parts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"part_number" text NOT NULL,
	"description" text NOT NULL,
	"kind" text NOT NULL,
	"unit" text NOT NULL,
	"oil_grade" text,
	"cost_minor" integer DEFAULT 0 NOT NULL,
	"price_minor" integer DEFAULT 0 NOT NULL,
	"supplier" text DEFAULT '' NOT NULL,
	"active" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "parts_org_part_number_unique" UNIQUE("organisation_id","part_number"),
	CONSTRAINT "parts_money_check" CHECK ("parts"."cost_minor" >= 0 and "parts"."price_minor" >= 0),
	CONSTRAINT "parts_oil_grade_check" CHECK (("parts"."kind" = 'oil') = ("parts"."oil_grade" is not null)),
	CONSTRAINT "parts_unit_check" CHECK ("parts"."unit" in ('L', '{each}'))
);
--> statement-breakpoint
CREATE TABLE "model_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"make" text NOT NULL,
	"model" text NOT NULL,
	"engine" text DEFAULT '' NOT NULL,
	"title" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL
);
--> statement-breakpoint
CREATE TABLE "vehicles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"registration" text NOT NULL,
	"vin" text,
	"make" text NOT NULL,
	"model" text NOT NULL,
	"engine" text DEFAULT '' NOT NULL,
	"fuel" text NOT NULL,
	"year" integer,
	"odometer_unit" text DEFAULT '[mi_i]' NOT NULL,
	"oil_grade" text,
	"oil_capacity_l" double precision,
	"oil_filter_part_id" uuid,
	"air_filter_part_id" uuid,
	"cabin_filter_part_id" uuid,
	"fuel_filter_part_id" uuid,
	"spark_plug_part_id" uuid,
	"spark_plug_count" integer,
	"plug_thread" text,
	"plug_seat" text,
	"plug_gap_mm" double precision,
	"plug_torque_nm" double precision,
	"sump_plug_torque_nm" double precision,
	"wheel_nut_torque_nm" double precision,
	"brake_fluid_grade" text,
	"tyre_pressure_front_kpa" double precision,
	"tyre_pressure_rear_kpa" double precision,
	"special_tools" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"service_interval_months" integer,
	"service_interval_distance" integer,
	"last_service_date" date,
	"last_service_odometer" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "vehicles_registration_check" CHECK ("vehicles"."registration" ~ '^[A-Z0-9]{1,10}$'),
	CONSTRAINT "vehicles_vin_check" CHECK ("vehicles"."vin" is null or "vehicles"."vin" ~ '^[A-HJ-NPR-Z0-9]{17}$'),
	CONSTRAINT "vehicles_year_check" CHECK ("vehicles"."year" is null or "vehicles"."year" between 1900 and 2100),
	CONSTRAINT "vehicles_oil_capacity_check" CHECK ("vehicles"."oil_capacity_l" is null or ("vehicles"."oil_capacity_l" > 0 and "vehicles"."oil_capacity_l" < 50)),
	CONSTRAINT "vehicles_plug_gap_check" CHECK ("vehicles"."plug_gap_mm" is null or ("vehicles"."plug_gap_mm" > 0 and "vehicles"."plug_gap_mm" < 3)),
	CONSTRAINT "vehicles_interval_check" CHECK (("vehicles"."service_interval_months" is null or "vehicles"."service_interval_months" > 0) and ("vehicles"."service_interval_distance" is null or "vehicles"."service_interval_distance" > 0))
);
--> statement-breakpoint
CREATE TABLE "checklist_templates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"labour_centi_hours" integer DEFAULT 100 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "checklist_templates_org_name_unique" UNIQUE("organisation_id","name"),
	CONSTRAINT "checklist_templates_labour_check" CHECK ("checklist_templates"."labour_centi_hours" >= 0)
);
--> statement-breakpoint
CREATE TABLE "template_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version_id" uuid NOT NULL,
	"section_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"kind" text NOT NULL,
	"label" text NOT NULL,
	"unit" text,
	"expected_min" double precision,
	"expected_max" double precision,
	"rule" text,
	"part_kind" text,
	"caution" text,
	"hint" text,
	CONSTRAINT "template_items_position_unique" UNIQUE("section_id","position"),
	CONSTRAINT "template_items_kind_check" CHECK ("template_items"."kind" in ('check', 'reading', 'part')),
	CONSTRAINT "template_items_reading_unit_check" CHECK ("template_items"."kind" <> 'reading' or "template_items"."unit" is not null),
	CONSTRAINT "template_items_range_check" CHECK ("template_items"."expected_min" is null or "template_items"."expected_max" is null or "template_items"."expected_min" <= "template_items"."expected_max")
);
--> statement-breakpoint
CREATE TABLE "template_sections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"title" text NOT NULL,
	CONSTRAINT "template_sections_position_unique" UNIQUE("version_id","position")
);
--> statement-breakpoint
CREATE TABLE "template_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template_id" uuid NOT NULL,
	"organisation_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"published_at" timestamp with time zone,
	"published_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "template_versions_template_version_unique" UNIQUE("template_id","version"),
	CONSTRAINT "template_versions_status_check" CHECK ("template_versions"."status" in ('draft', 'published', 'retired')),
	CONSTRAINT "template_versions_published_check" CHECK (("template_versions"."status" = 'draft') = ("template_versions"."published_at" is null))
);
--> statement-breakpoint
CREATE TABLE "round_removals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"visit_id" uuid NOT NULL,
	"technician_id" text NOT NULL,
	"removed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL
);
--> statement-breakpoint
CREATE TABLE "visits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"customer_id" uuid NOT NULL,
	"vehicle_id" uuid NOT NULL,
	"technician_id" text NOT NULL,
	"template_version_id" uuid NOT NULL,
	"round_date" date NOT NULL,
	"round_position" integer DEFAULT 0 NOT NULL,
	"slot_start" timestamp with time zone NOT NULL,
	"slot_end" timestamp with time zone NOT NULL,
	"address_lines" text NOT NULL,
	"postcode" text DEFAULT '' NOT NULL,
	"access_notes" text DEFAULT '' NOT NULL,
	"status" text DEFAULT 'booked' NOT NULL,
	"reviewed_at" timestamp with time zone,
	"reviewed_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "visits_slot_check" CHECK ("visits"."slot_start" < "visits"."slot_end"),
	CONSTRAINT "visits_status_check" CHECK ("visits"."status" in ('booked', 'in_progress', 'signed_off', 'reviewed', 'invoiced', 'paid', 'cancelled'))
);
--> statement-breakpoint
CREATE TABLE "check_results" (
	"visit_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"state" text NOT NULL,
	"stamp" text NOT NULL,
	"op_id" uuid NOT NULL,
	"updated_by" text NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "check_results_visit_id_item_id_pk" PRIMARY KEY("visit_id","item_id"),
	CONSTRAINT "check_results_state_check" CHECK ("check_results"."state" in ('done', 'skipped', 'not_yet'))
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"visit_id" uuid NOT NULL,
	"item_id" uuid,
	"title" text NOT NULL,
	"detail" text DEFAULT '' NOT NULL,
	"severity" text NOT NULL,
	"severity_stamp" text NOT NULL,
	"stamp" text NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "findings_severity_check" CHECK ("findings"."severity" in ('ok', 'watch', 'soon', 'now'))
);
--> statement-breakpoint
CREATE TABLE "part_lines" (
	"id" uuid PRIMARY KEY NOT NULL,
	"visit_id" uuid NOT NULL,
	"item_id" uuid,
	"part_id" uuid,
	"part_number" text NOT NULL,
	"description" text NOT NULL,
	"quantity" double precision NOT NULL,
	"unit" text NOT NULL,
	"removed" boolean DEFAULT false NOT NULL,
	"stamp" text NOT NULL,
	"updated_by" text NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "part_lines_quantity_check" CHECK ("part_lines"."quantity" > 0)
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY NOT NULL,
	"visit_id" uuid NOT NULL,
	"finding_id" uuid,
	"item_id" uuid,
	"caption" text DEFAULT '' NOT NULL,
	"object_key" text NOT NULL,
	"sha256" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"content_type" text NOT NULL,
	"width" integer,
	"height" integer,
	"thumbnail_key" text,
	"add_stamp" text NOT NULL,
	"removed_stamp" text,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "photos_sha256_check" CHECK ("photos"."sha256" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "photos_size_check" CHECK ("photos"."size_bytes" > 0)
);
--> statement-breakpoint
CREATE TABLE "reading_results" (
	"visit_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"value" double precision,
	"text_value" text,
	"unit" text,
	"stamp" text NOT NULL,
	"op_id" uuid NOT NULL,
	"updated_by" text NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "reading_results_visit_id_item_id_pk" PRIMARY KEY("visit_id","item_id"),
	CONSTRAINT "reading_results_value_check" CHECK ("reading_results"."value" is not null or "reading_results"."text_value" is not null)
);
--> statement-breakpoint
CREATE TABLE "sign_offs" (
	"id" uuid PRIMARY KEY NOT NULL,
	"visit_id" uuid NOT NULL,
	"odometer" integer NOT NULL,
	"odometer_unit" text NOT NULL,
	"customer_name" text NOT NULL,
	"signature_svg" text NOT NULL,
	"declaration" text NOT NULL,
	"technician_id" text NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	"stamp" text NOT NULL,
	"op_id" uuid NOT NULL,
	"voided_at" timestamp with time zone,
	"voided_by" text,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL,
	CONSTRAINT "sign_offs_odometer_check" CHECK ("sign_offs"."odometer" >= 0)
);
--> statement-breakpoint
CREATE TABLE "visit_notes" (
	"id" uuid PRIMARY KEY NOT NULL,
	"visit_id" uuid NOT NULL,
	"body" text NOT NULL,
	"author_id" text NOT NULL,
	"stamp" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL
);
--> statement-breakpoint
CREATE TABLE "conflicts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"visit_id" uuid NOT NULL,
	"op_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"entity_id" text NOT NULL,
	"reason" text NOT NULL,
	"proposed" jsonb NOT NULL,
	"standing" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"resolved_at" timestamp with time zone,
	"resolved_by" text,
	"resolution" text,
	"change_seq" bigint DEFAULT nextval('change_seq') NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sync_operations" (
	"op_id" uuid PRIMARY KEY NOT NULL,
	"organisation_id" uuid NOT NULL,
	"visit_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"device_id" text NOT NULL,
	"kind" text NOT NULL,
	"entity_id" text NOT NULL,
	"stamp" text NOT NULL,
	"seen_stamp" text,
	"payload" jsonb NOT NULL,
	"outcome" text NOT NULL,
	"reason" text,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sync_operations_outcome_check" CHECK ("sync_operations"."outcome" in ('applied', 'duplicate', 'superseded', 'conflict', 'locked', 'rejected'))
);
--> statement-breakpoint
ALTER TABLE "account" ADD CONSTRAINT "account_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "session" ADD CONSTRAINT "session_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user" ADD CONSTRAINT "user_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "customers" ADD CONSTRAINT "customers_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts" ADD CONSTRAINT "parts_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "model_notes" ADD CONSTRAINT "model_notes_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_customer_id_customers_id_fk" FOREIGN KEY ("customer_id") REFERENCES "public"."customers"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_oil_filter_part_id_parts_id_fk" FOREIGN KEY ("oil_filter_part_id") REFERENCES "public"."parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_air_filter_part_id_parts_id_fk" FOREIGN KEY ("air_filter_part_id") REFERENCES "public"."parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_cabin_filter_part_id_parts_id_fk" FOREIGN KEY ("cabin_filter_part_id") REFERENCES "public"."parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_fuel_filter_part_id_parts_id_fk" FOREIGN KEY ("fuel_filter_part_id") REFERENCES "public"."parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vehicles" ADD CONSTRAINT "vehicles_spark_plug_part_id_parts_id_fk" FOREIGN KEY ("spark_plug_part_id") REFERENCES "public"."parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklist_templates" ADD CONSTRAINT "checklist_templates_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_items" ADD CONSTRAINT "template_items_version_id_template_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."template_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_items" ADD CONSTRAINT "template_items_section_id_template_sections_id_fk" FOREIGN KEY ("section_id") REFERENCES "public"."template_sections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_sections" ADD CONSTRAINT "template_sections_version_id_template_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."template_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_versions" ADD CONSTRAINT "template_versions_template_id_checklist_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."checklist_templates"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_versions" ADD CONSTRAINT "template_versions_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "round_removals" ADD CONSTRAINT "round_removals_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "round_removals" ADD CONSTRAINT "round_removals_technician_id_user_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_customer_id_customers_id_fk" FOREIGN KEY ("customer_id") REFERENCES "public"."customers"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_vehicle_id_vehicles_id_fk" FOREIGN KEY ("vehicle_id") REFERENCES "public"."vehicles"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_technician_id_user_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_template_version_id_template_versions_id_fk" FOREIGN KEY ("template_version_id") REFERENCES "public"."template_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_reviewed_by_user_id_fk" FOREIGN KEY ("reviewed_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "check_results" ADD CONSTRAINT "check_results_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "check_results" ADD CONSTRAINT "check_results_item_id_template_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."template_items"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_item_id_template_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."template_items"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_lines" ADD CONSTRAINT "part_lines_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_lines" ADD CONSTRAINT "part_lines_item_id_template_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."template_items"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_lines" ADD CONSTRAINT "part_lines_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_results" ADD CONSTRAINT "reading_results_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_results" ADD CONSTRAINT "reading_results_item_id_template_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."template_items"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_technician_id_user_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visit_notes" ADD CONSTRAINT "visit_notes_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "conflicts" ADD CONSTRAINT "conflicts_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "conflicts" ADD CONSTRAINT "conflicts_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "conflicts" ADD CONSTRAINT "conflicts_op_id_sync_operations_op_id_fk" FOREIGN KEY ("op_id") REFERENCES "public"."sync_operations"("op_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_operations" ADD CONSTRAINT "sync_operations_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_operations" ADD CONSTRAINT "sync_operations_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "account_user_idx" ON "account" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "session_user_idx" ON "session" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "user_organisation_idx" ON "user" USING btree ("organisation_id","role");--> statement-breakpoint
CREATE INDEX "verification_identifier_idx" ON "verification" USING btree ("identifier");--> statement-breakpoint
CREATE INDEX "customers_org_name_idx" ON "customers" USING btree ("organisation_id","name");--> statement-breakpoint
CREATE INDEX "customers_change_seq_idx" ON "customers" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "parts_org_kind_idx" ON "parts" USING btree ("organisation_id","kind");--> statement-breakpoint
CREATE INDEX "model_notes_match_idx" ON "model_notes" USING btree ("organisation_id","make","model");--> statement-breakpoint
CREATE INDEX "model_notes_change_seq_idx" ON "model_notes" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "vehicles_org_registration_idx" ON "vehicles" USING btree ("organisation_id","registration");--> statement-breakpoint
CREATE INDEX "vehicles_customer_idx" ON "vehicles" USING btree ("customer_id");--> statement-breakpoint
CREATE INDEX "vehicles_change_seq_idx" ON "vehicles" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "template_items_version_idx" ON "template_items" USING btree ("version_id");--> statement-breakpoint
CREATE INDEX "template_versions_change_seq_idx" ON "template_versions" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "round_removals_tech_seq_idx" ON "round_removals" USING btree ("technician_id","change_seq");--> statement-breakpoint
CREATE INDEX "visits_round_idx" ON "visits" USING btree ("technician_id","round_date","round_position");--> statement-breakpoint
CREATE INDEX "visits_org_status_idx" ON "visits" USING btree ("organisation_id","status","round_date");--> statement-breakpoint
CREATE INDEX "visits_org_date_idx" ON "visits" USING btree ("organisation_id","round_date");--> statement-breakpoint
CREATE INDEX "visits_vehicle_idx" ON "visits" USING btree ("vehicle_id","round_date");--> statement-breakpoint
CREATE INDEX "visits_change_seq_idx" ON "visits" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "check_results_change_seq_idx" ON "check_results" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "findings_visit_idx" ON "findings" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "findings_severity_idx" ON "findings" USING btree ("severity");--> statement-breakpoint
CREATE INDEX "findings_change_seq_idx" ON "findings" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "part_lines_visit_idx" ON "part_lines" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "part_lines_change_seq_idx" ON "part_lines" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "photos_visit_idx" ON "photos" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "photos_change_seq_idx" ON "photos" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "reading_results_change_seq_idx" ON "reading_results" USING btree ("change_seq");--> statement-breakpoint
CREATE UNIQUE INDEX "sign_offs_one_live_per_visit" ON "sign_offs" USING btree ("visit_id") WHERE "sign_offs"."voided_at" is null;--> statement-breakpoint
CREATE INDEX "sign_offs_change_seq_idx" ON "sign_offs" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "visit_notes_visit_idx" ON "visit_notes" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "visit_notes_change_seq_idx" ON "visit_notes" USING btree ("change_seq");--> statement-breakpoint
CREATE INDEX "conflicts_open_idx" ON "conflicts" USING btree ("organisation_id","resolved_at");--> statement-breakpoint
CREATE INDEX "conflicts_visit_idx" ON "conflicts" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "sync_operations_visit_idx" ON "sync_operations" USING btree ("visit_id","received_at");