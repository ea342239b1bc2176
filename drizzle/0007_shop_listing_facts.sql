ALTER TABLE `shop_listings` ADD `section_count` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_listings` ADD `finished_width_in` real;--> statement-breakpoint
ALTER TABLE `shop_listings` ADD `finished_height_in` real;--> statement-breakpoint
ALTER TABLE `shop_listings` ADD `preview_svg` text;