CREATE TABLE `pattern_previews` (
	`pattern_id` text PRIMARY KEY NOT NULL,
	`revision_number` integer NOT NULL,
	`renderer_version` integer NOT NULL,
	`section_count` integer NOT NULL,
	`width_in` real NOT NULL,
	`height_in` real NOT NULL,
	`display_unit` text NOT NULL,
	`svg` text,
	FOREIGN KEY (`pattern_id`) REFERENCES `patterns`(`id`) ON UPDATE no action ON DELETE cascade
);
