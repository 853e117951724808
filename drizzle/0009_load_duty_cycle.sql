ALTER TABLE `loads` ADD `duty_pct` real;--> statement-breakpoint
ALTER TABLE `loads` ADD `days_per_week` integer;