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
CREATE INDEX `oven_change_wo_idx` ON `oven_change` (`work_order_id`);--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`recipient_user_id` text,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`html` text NOT NULL,
	`text` text NOT NULL,
	`headers` text NOT NULL,
	`idempotency_key` text NOT NULL,
	`state` text DEFAULT 'pending' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`last_error` text,
	`smtp_response` text,
	`lease_token` text,
	`claimed_at` integer,
	`created_at` integer NOT NULL,
	`sent_at` integer,
	FOREIGN KEY (`recipient_user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `outbox_idempotency_unique` ON `outbox` (`idempotency_key`);--> statement-breakpoint
CREATE INDEX `outbox_state_next_idx` ON `outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `outbox_recipient_idx` ON `outbox` (`recipient_user_id`);--> statement-breakpoint
CREATE INDEX `outbox_created_idx` ON `outbox` (`created_at`);--> statement-breakpoint
CREATE TABLE `scheduler_lease` (
	`name` text PRIMARY KEY NOT NULL,
	`holder` text NOT NULL,
	`expires_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `subscription` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	`enabled` integer DEFAULT true NOT NULL,
	`schedule` text,
	`send_at` text,
	`last_enqueued_occurrence` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `subscription_user_kind_unique` ON `subscription` (`user_id`,`kind`);--> statement-breakpoint
CREATE INDEX `subscription_kind_idx` ON `subscription` (`kind`,`enabled`);--> statement-breakpoint
ALTER TABLE `user` ADD `time_zone` text DEFAULT 'Europe/Dublin' NOT NULL;