CREATE INDEX `projects_org_updated_idx` ON `projects` (`org_id`,`updated_at`,`id`);--> statement-breakpoint
CREATE INDEX `submission_events_org_idx` ON `submission_events` (`org_id`);--> statement-breakpoint
CREATE INDEX `submissions_org_created_idx` ON `submissions` (`org_id`,`created_at`,`id`);