CREATE TABLE `alert` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`oven_id` integer NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`reasons` text NOT NULL,
	`run_id` integer,
	`raised_at` integer NOT NULL,
	`acknowledged_at` integer,
	`acknowledged_by` text,
	`note` text,
	`work_order_id` integer,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`acknowledged_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `alert_oven_idx` ON `alert` (`oven_id`,`raised_at`);--> statement-breakpoint
CREATE INDEX `alert_open_idx` ON `alert` (`acknowledged_at`);--> statement-breakpoint
CREATE TABLE `drift_baseline` (
	`oven_id` integer NOT NULL,
	`metric` text NOT NULL,
	`from_run_id` integer NOT NULL,
	`to_run_id` integer NOT NULL,
	`set_by` text,
	`set_at` integer NOT NULL,
	PRIMARY KEY(`oven_id`, `metric`),
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`from_run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`to_run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`set_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `drift_point` (
	`run_id` integer NOT NULL,
	`metric` text NOT NULL,
	`oven_id` integer NOT NULL,
	`at` integer NOT NULL,
	`value` real NOT NULL,
	`ewma` real NOT NULL,
	`ewma_ucl` real NOT NULL,
	`ewma_lcl` real NOT NULL,
	`cusum_high` real NOT NULL,
	`cusum_low` real NOT NULL,
	`signals` text NOT NULL,
	PRIMARY KEY(`run_id`, `metric`),
	FOREIGN KEY (`run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `drift_point_oven_metric_at_idx` ON `drift_point` (`oven_id`,`metric`,`at`);--> statement-breakpoint
CREATE TABLE `drift_state` (
	`oven_id` integer NOT NULL,
	`metric` text NOT NULL,
	`baseline` text NOT NULL,
	`state` text,
	`last_run_id` integer,
	`last_run_at` integer,
	`updated_at` integer NOT NULL,
	PRIMARY KEY(`oven_id`, `metric`),
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `oven_health` (
	`oven_id` integer PRIMARY KEY NOT NULL,
	`state` text NOT NULL,
	`reasons` text NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action
);
