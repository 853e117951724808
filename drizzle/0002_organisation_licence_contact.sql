ALTER TABLE `organisations` ADD `licence_number` text;--> statement-breakpoint
ALTER TABLE `organisations` ADD `licence_classification` text;--> statement-breakpoint
ALTER TABLE `organisations` ADD `licence_state` text;--> statement-breakpoint
ALTER TABLE `organisations` ADD `phone` text;--> statement-breakpoint
ALTER TABLE `organisations` ADD `email` text;--> statement-breakpoint
ALTER TABLE `organisations` ADD `address` text;