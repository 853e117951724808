CREATE TABLE `review_note_replies` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`note_id` text NOT NULL,
	`user_id` text,
	`action` text NOT NULL,
	`body` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`note_id`) REFERENCES `review_notes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `review_note_replies_note_idx` ON `review_note_replies` (`note_id`);