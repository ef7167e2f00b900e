CREATE TABLE "refused_operations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"device_id" text NOT NULL,
	"op_id" text NOT NULL,
	"visit_id" text,
	"kind" text,
	"body" jsonb NOT NULL,
	"reason" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "refused_operations" ADD CONSTRAINT "refused_operations_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "refused_operations_once" ON "refused_operations" USING btree ("organisation_id","device_id","op_id","reason");--> statement-breakpoint
CREATE INDEX "refused_operations_org_idx" ON "refused_operations" USING btree ("organisation_id","received_at");