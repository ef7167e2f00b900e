CREATE TABLE "oil_containers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"size_l" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "oil_containers_part_size_unique" UNIQUE("part_id","size_l"),
	CONSTRAINT "oil_containers_size_check" CHECK ("oil_containers"."size_l" > 0 and "oil_containers"."size_l" <= 1000)
);
--> statement-breakpoint
CREATE TABLE "used_oil_disposals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"technician_id" text NOT NULL,
	"disposed_at" timestamp with time zone NOT NULL,
	"site_name" text NOT NULL,
	"site_licence" text DEFAULT '' NOT NULL,
	"reference" text DEFAULT '' NOT NULL,
	"litres" double precision NOT NULL,
	"recorded_by" text,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "used_oil_disposals_litres_check" CHECK ("used_oil_disposals"."litres" > 0 and "used_oil_disposals"."litres" < 100000),
	CONSTRAINT "used_oil_disposals_site_check" CHECK (length(trim("used_oil_disposals"."site_name")) > 0)
);
--> statement-breakpoint
CREATE TABLE "van_stock_minimums" (
	"organisation_id" uuid NOT NULL,
	"technician_id" text NOT NULL,
	"part_id" uuid NOT NULL,
	"minimum" double precision NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "van_stock_minimums_technician_id_part_id_pk" PRIMARY KEY("technician_id","part_id"),
	CONSTRAINT "van_stock_minimums_check" CHECK ("van_stock_minimums"."minimum" >= 0)
);
--> statement-breakpoint
CREATE TABLE "van_stock_movements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organisation_id" uuid NOT NULL,
	"technician_id" text NOT NULL,
	"part_id" uuid NOT NULL,
	"quantity" double precision NOT NULL,
	"reason" text NOT NULL,
	"visit_id" uuid,
	"part_line_id" uuid,
	"note" text DEFAULT '' NOT NULL,
	"recorded_by" text,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "van_stock_movements_quantity_check" CHECK ("van_stock_movements"."quantity" <> 0),
	CONSTRAINT "van_stock_movements_reason_check" CHECK ("van_stock_movements"."reason" in ('restock', 'fitted', 'count', 'returned'))
);
--> statement-breakpoint
ALTER TABLE "oil_containers" ADD CONSTRAINT "oil_containers_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "oil_containers" ADD CONSTRAINT "oil_containers_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "used_oil_disposals" ADD CONSTRAINT "used_oil_disposals_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "used_oil_disposals" ADD CONSTRAINT "used_oil_disposals_technician_id_user_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "used_oil_disposals" ADD CONSTRAINT "used_oil_disposals_recorded_by_user_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_minimums" ADD CONSTRAINT "van_stock_minimums_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_minimums" ADD CONSTRAINT "van_stock_minimums_technician_id_user_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_minimums" ADD CONSTRAINT "van_stock_minimums_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_movements" ADD CONSTRAINT "van_stock_movements_organisation_id_organisations_id_fk" FOREIGN KEY ("organisation_id") REFERENCES "public"."organisations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_movements" ADD CONSTRAINT "van_stock_movements_technician_id_user_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_movements" ADD CONSTRAINT "van_stock_movements_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_movements" ADD CONSTRAINT "van_stock_movements_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_movements" ADD CONSTRAINT "van_stock_movements_part_line_id_part_lines_id_fk" FOREIGN KEY ("part_line_id") REFERENCES "public"."part_lines"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "van_stock_movements" ADD CONSTRAINT "van_stock_movements_recorded_by_user_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "used_oil_disposals_van_idx" ON "used_oil_disposals" USING btree ("organisation_id","technician_id","disposed_at");--> statement-breakpoint
CREATE INDEX "van_stock_movements_van_idx" ON "van_stock_movements" USING btree ("organisation_id","technician_id","part_id");--> statement-breakpoint
CREATE INDEX "van_stock_movements_part_line_idx" ON "van_stock_movements" USING btree ("part_line_id");--> statement-breakpoint
CREATE INDEX "van_stock_movements_recorded_idx" ON "van_stock_movements" USING btree ("technician_id","recorded_at");