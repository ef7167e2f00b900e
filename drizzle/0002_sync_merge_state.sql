CREATE TABLE "photo_objects" (
	"organisation_id" uuid NOT NULL,
	"sha256" text NOT NULL,
	"object_key" text NOT NULL,
	"thumbnail_key" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"uploaded_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "photo_objects_organisation_id_sha256_pk" PRIMARY KEY("organisation_id","sha256"),
	CONSTRAINT "photo_objects_sha256_check" CHECK ("photo_objects"."sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
CREATE TABLE "sync_clocks" (
	"organisation_id" uuid PRIMARY KEY NOT NULL,
	"stamp" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sync_devices" (
	"organisation_id" uuid NOT NULL,
	"device_id" text NOT NULL,
	"user_id" text NOT NULL,
	"last_bounded_stamp" text,
	"bounded_count" integer DEFAULT 0 NOT NULL,
	"last_push_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sync_devices_organisation_id_device_id_pk" PRIMARY KEY("organisation_id","device_id")
);
--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "severity_log" jsonb;--> statement-breakpoint
ALTER TABLE "sync_operations" ADD COLUMN "effective_stamp" text;--> statement-breakpoint
ALTER TABLE "photo_objects" ADD CONSTRAINT "photo_objects_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_clocks" ADD CONSTRAINT "sync_clocks_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_devices" ADD CONSTRAINT "sync_devices_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sync_operations_entity_idx" ON "sync_operations" USING btree ("visit_id","entity_id");--> statement-breakpoint
CREATE INDEX "sync_operations_device_stamp_idx" ON "sync_operations" USING btree ("organisation_id","device_id","stamp");