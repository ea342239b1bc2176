PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_sewing_log` (
	`pattern_id` text NOT NULL,
	`user_id` text NOT NULL,
	`section_id` text NOT NULL,
	`copy` integer DEFAULT 1 NOT NULL,
	`stage` text NOT NULL,
	`updated_at` integer NOT NULL,
	PRIMARY KEY(`pattern_id`, `user_id`, `section_id`, `copy`),
	FOREIGN KEY (`pattern_id`) REFERENCES `patterns`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
-- The log now keeps a stage per copy of a section, with stages pieced, trimmed, joined (docs/api.md).
-- A section's old stage carries over to its first copy only, so the log never claims more than the
-- quilter recorded: 'sewn' becomes 'pieced', 'trimmed' stays, and 'cut' (fabric cut, nothing sewn) is dropped.
INSERT INTO `__new_sewing_log`("pattern_id", "user_id", "section_id", "copy", "stage", "updated_at") SELECT "pattern_id", "user_id", "section_id", 1, CASE "stage" WHEN 'sewn' THEN 'pieced' ELSE "stage" END, "updated_at" FROM `sewing_log` WHERE "stage" IN ('sewn', 'trimmed');--> statement-breakpoint
DROP TABLE `sewing_log`;--> statement-breakpoint
ALTER TABLE `__new_sewing_log` RENAME TO `sewing_log`;--> statement-breakpoint
PRAGMA foreign_keys=ON;