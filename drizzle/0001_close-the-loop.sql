ALTER TABLE "service_reminders" DROP CONSTRAINT "service_reminders_once_per_due";--> statement-breakpoint
ALTER TABLE "service_reminders" ALTER COLUMN "basis_odometer" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "service_reminders" ADD CONSTRAINT "service_reminders_once_per_due" UNIQUE NULLS NOT DISTINCT("vehicle_id","basis_date","basis_odometer");