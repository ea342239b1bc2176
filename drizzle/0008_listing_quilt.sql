ALTER TABLE `shop_listings` ADD `quilt_sizes` text;--> statement-breakpoint
ALTER TABLE `shop_listings` ADD `quilt_pictures` text;