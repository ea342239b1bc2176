CREATE TABLE `colourway_copies` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`pattern_id` text NOT NULL,
	`source_colourway_id` text,
	`name` text NOT NULL,
	`fabrics` text NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`pattern_id`) REFERENCES `patterns`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `colourway_copies_user_pattern_idx` ON `colourway_copies` (`user_id`,`pattern_id`);--> statement-breakpoint
CREATE INDEX `colourway_copies_pattern_idx` ON `colourway_copies` (`pattern_id`);