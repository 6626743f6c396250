CREATE TABLE `drift_setting` (
	`oven_id` integer PRIMARY KEY NOT NULL,
	`lambda` real NOT NULL,
	`l` real NOT NULL,
	`cusum_k` real NOT NULL,
	`cusum_h` real NOT NULL,
	`updated_by` text,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`updated_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
