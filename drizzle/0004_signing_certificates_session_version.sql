CREATE TABLE `packet_signatures` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`signed_pdf_sha256` text NOT NULL,
	`unsigned_pdf_sha256` text NOT NULL,
	`signer_id` text NOT NULL,
	`certificate_id` text,
	`certificate_subject` text NOT NULL,
	`certificate_fingerprint` text NOT NULL,
	`signed_at` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revision_id`) REFERENCES `packet_revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`signer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`certificate_id`) REFERENCES `signing_certificates`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `packet_signatures_sha_idx` ON `packet_signatures` (`signed_pdf_sha256`);--> statement-breakpoint
CREATE INDEX `packet_signatures_revision_idx` ON `packet_signatures` (`revision_id`);--> statement-breakpoint
CREATE TABLE `signing_certificates` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`user_id` text NOT NULL,
	`sealed` text NOT NULL,
	`file_name` text NOT NULL,
	`subject_name` text NOT NULL,
	`issuer_name` text NOT NULL,
	`serial_number` text NOT NULL,
	`not_before` text NOT NULL,
	`not_after` text NOT NULL,
	`fingerprint_sha256` text NOT NULL,
	`current` integer DEFAULT true NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `signing_certificates_user_idx` ON `signing_certificates` (`user_id`,`current`);--> statement-breakpoint
ALTER TABLE `users` ADD `session_version` integer DEFAULT 0 NOT NULL;