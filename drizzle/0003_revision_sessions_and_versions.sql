ALTER TABLE `revisions` ADD `edit_session` text;--> statement-breakpoint
ALTER TABLE `revisions` ADD `group_start` integer;--> statement-breakpoint
ALTER TABLE `revisions` ADD `version_name` text;--> statement-breakpoint
ALTER TABLE `revisions` ADD `version_note` text;