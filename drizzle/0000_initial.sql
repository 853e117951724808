CREATE TABLE `organisations` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`slug` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `organisations_slug_unique` ON `organisations` (`slug`);--> statement-breakpoint
CREATE TABLE `user_roles` (
	`user_id` text NOT NULL,
	`role` text NOT NULL,
	PRIMARY KEY(`user_id`, `role`),
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`password_hash` text NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`failed_sign_ins` integer DEFAULT 0 NOT NULL,
	`locked_until` text,
	`last_sign_in_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE INDEX `users_org_idx` ON `users` (`org_id`);--> statement-breakpoint
CREATE TABLE `reviewer_licences` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`user_id` text NOT NULL,
	`licence_number` text NOT NULL,
	`region` text NOT NULL,
	`discipline` text DEFAULT 'Electrical' NOT NULL,
	`expires_on` text,
	`stamp_attachment_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `reviewer_licences_user_idx` ON `reviewer_licences` (`user_id`);--> statement-breakpoint
CREATE TABLE `jurisdictions` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`name` text NOT NULL,
	`region` text DEFAULT '' NOT NULL,
	`nec_edition` text NOT NULL,
	`residential_code` text DEFAULT 'none' NOT NULL,
	`amendments` text DEFAULT '' NOT NULL,
	`voltage_drop_limit_pct` real,
	`storage_aggregate_limit_kwh` real,
	`label_rules` text DEFAULT '{}' NOT NULL,
	`submission_method` text DEFAULT 'portal' NOT NULL,
	`contact` text DEFAULT '{}' NOT NULL,
	`typical_review_days` integer,
	`fee_notes` text DEFAULT '' NOT NULL,
	`required_documents` text DEFAULT '["equipment-datasheets","storage-listing","site-plan"]' NOT NULL,
	`template_overrides` text DEFAULT '{}' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `jurisdictions_org_idx` ON `jurisdictions` (`org_id`);--> statement-breakpoint
CREATE TABLE `equipment_library` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`kind` text NOT NULL,
	`manufacturer` text DEFAULT '' NOT NULL,
	`model` text DEFAULT '' NOT NULL,
	`ratings` text DEFAULT '{}' NOT NULL,
	`datasheet_attachment_id` text,
	`retired_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `equipment_library_org_idx` ON `equipment_library` (`org_id`,`kind`);--> statement-breakpoint
CREATE TABLE `projects` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`jurisdiction_id` text,
	`name` text NOT NULL,
	`client` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'design' NOT NULL,
	`system_kind` text NOT NULL,
	`address` text DEFAULT '' NOT NULL,
	`occupancy` text DEFAULT 'one-two-family-dwelling' NOT NULL,
	`mounting` text DEFAULT 'ground' NOT NULL,
	`roof_clearance_in` real,
	`design_low_temp_c` real,
	`design_low_temp_source` text DEFAULT '' NOT NULL,
	`design_high_temp_c` real,
	`design_high_temp_source` text DEFAULT '' NOT NULL,
	`sun_hours_per_day` real,
	`battery_location` text,
	`battery_location_note` text DEFAULT '' NOT NULL,
	`battery_spacing_in` real,
	`has_smoke_or_heat_detection` integer,
	`has_vehicle_impact_protection` integer,
	`days_of_autonomy` real,
	`rapid_shutdown_method` text,
	`extra` text DEFAULT '{}' NOT NULL,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`jurisdiction_id`) REFERENCES `jurisdictions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `projects_org_idx` ON `projects` (`org_id`,`status`);--> statement-breakpoint
CREATE TABLE `project_equipment` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`library_item_id` text,
	`tag` text NOT NULL,
	`kind` text NOT NULL,
	`quantity` integer DEFAULT 1 NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`data` text NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`library_item_id`) REFERENCES `equipment_library`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `project_equipment_tag_idx` ON `project_equipment` (`project_id`,`tag`);--> statement-breakpoint
CREATE INDEX `project_equipment_project_idx` ON `project_equipment` (`project_id`);--> statement-breakpoint
CREATE TABLE `pv_arrays` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`tag` text NOT NULL,
	`module_tag` text NOT NULL,
	`modules_in_series` integer NOT NULL,
	`strings_in_parallel` integer NOT NULL,
	`feeds_tag` text NOT NULL,
	`mppt_input_id` text,
	`position` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `pv_arrays_tag_idx` ON `pv_arrays` (`project_id`,`tag`);--> statement-breakpoint
CREATE TABLE `circuits` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`tag` text NOT NULL,
	`from_tag` text NOT NULL,
	`to_tag` text NOT NULL,
	`kind` text NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`data` text NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `circuits_tag_idx` ON `circuits` (`project_id`,`tag`);--> statement-breakpoint
CREATE TABLE `loads` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`name` text NOT NULL,
	`watts` real NOT NULL,
	`quantity` integer DEFAULT 1 NOT NULL,
	`hours_per_day` real NOT NULL,
	`surge_w` real,
	`voltage_v` integer DEFAULT 120 NOT NULL,
	`simultaneous` integer DEFAULT true NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `attachments` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`project_id` text,
	`library_item_id` text,
	`equipment_tag` text,
	`kind` text NOT NULL,
	`file_name` text NOT NULL,
	`mime_type` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`page_count` integer,
	`sha256` text NOT NULL,
	`uploaded_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`library_item_id`) REFERENCES `equipment_library`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `attachments_project_idx` ON `attachments` (`org_id`,`project_id`);--> statement-breakpoint
CREATE INDEX `attachments_sha_idx` ON `attachments` (`org_id`,`sha256`);--> statement-breakpoint
CREATE TABLE `packet_revisions` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`project_id` text NOT NULL,
	`number` integer NOT NULL,
	`state` text DEFAULT 'generating' NOT NULL,
	`progress_step` text DEFAULT 'queued' NOT NULL,
	`error` text,
	`review_state` text DEFAULT 'draft' NOT NULL,
	`record_snapshot` text NOT NULL,
	`results_snapshot` text NOT NULL,
	`record_sha256` text NOT NULL,
	`attachment_ids` text DEFAULT '[]' NOT NULL,
	`is_draft` integer DEFAULT true NOT NULL,
	`pdf_path` text,
	`pdf_sha256` text,
	`page_count` integer,
	`docx_path` text,
	`docx_sha256` text,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `packet_revisions_number_idx` ON `packet_revisions` (`project_id`,`number`);--> statement-breakpoint
CREATE INDEX `packet_revisions_org_idx` ON `packet_revisions` (`org_id`,`review_state`);--> statement-breakpoint
CREATE TABLE `review_notes` (
	`id` text PRIMARY KEY NOT NULL,
	`review_id` text NOT NULL,
	`target_kind` text NOT NULL,
	`target_id` text DEFAULT '' NOT NULL,
	`text` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`review_id`) REFERENCES `reviews`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `reviews` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`reviewer_id` text NOT NULL,
	`decision` text NOT NULL,
	`general_notes` text DEFAULT '' NOT NULL,
	`licence_snapshot` text,
	`approved_sha256` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revision_id`) REFERENCES `packet_revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reviewer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `reviews_revision_idx` ON `reviews` (`revision_id`);--> statement-breakpoint
CREATE TABLE `submission_events` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`submission_id` text NOT NULL,
	`kind` text NOT NULL,
	`occurred_on` text NOT NULL,
	`user_id` text,
	`note` text DEFAULT '' NOT NULL,
	`data` text DEFAULT '{}' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`submission_id`) REFERENCES `submissions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `submission_events_submission_idx` ON `submission_events` (`submission_id`);--> statement-breakpoint
CREATE TABLE `submissions` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`project_id` text NOT NULL,
	`jurisdiction_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`method` text NOT NULL,
	`reference_number` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'submitted' NOT NULL,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`jurisdiction_id`) REFERENCES `jurisdictions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revision_id`) REFERENCES `packet_revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `submissions_org_idx` ON `submissions` (`org_id`,`status`);--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`user_id` text,
	`action` text NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text,
	`detail` text DEFAULT '{}' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `audit_log_org_idx` ON `audit_log` (`org_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`to_address` text NOT NULL,
	`subject` text NOT NULL,
	`body_text` text NOT NULL,
	`template` text NOT NULL,
	`status` text DEFAULT 'queued' NOT NULL,
	`error` text,
	`message_id` text,
	`sent_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `outbox_org_idx` ON `outbox` (`org_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `site_confirmations` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`item_kind` text NOT NULL,
	`item_id` text NOT NULL,
	`confirmed_by` text,
	`photo_attachment_id` text,
	`note` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revision_id`) REFERENCES `packet_revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`confirmed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `site_confirmations_item_idx` ON `site_confirmations` (`revision_id`,`item_kind`,`item_id`);