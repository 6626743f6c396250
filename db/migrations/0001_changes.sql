CREATE TABLE `oven_change` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`oven_id` integer NOT NULL,
	`at` integer NOT NULL,
	`area` text NOT NULL,
	`summary` text NOT NULL,
	`before` text,
	`after` text NOT NULL,
	`reason` text,
	`work_order_id` integer,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `oven_change_oven_at_idx` ON `oven_change` (`oven_id`,`at`);--> statement-breakpoint
CREATE INDEX `oven_change_area_idx` ON `oven_change` (`area`);--> statement-breakpoint
CREATE INDEX `oven_change_at_idx` ON `oven_change` (`at`);--> statement-breakpoint
CREATE INDEX `oven_change_wo_idx` ON `oven_change` (`work_order_id`);