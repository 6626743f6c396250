CREATE TABLE `maintenance_plan` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`oven_id` integer NOT NULL,
	`group_key` text,
	`template_id` text,
	`title` text NOT NULL,
	`instructions` text DEFAULT '' NOT NULL,
	`checklist` text DEFAULT '[]' NOT NULL,
	`estimated_minutes` integer,
	`kind` text DEFAULT 'preventive' NOT NULL,
	`assignee_id` text,
	`assignee_role` text,
	`safety_lockout` integer DEFAULT false NOT NULL,
	`rrule` text,
	`dtstart_local` text,
	`every_runs` integer,
	`every_heater_hours` real,
	`meter_baseline` real,
	`look_ahead_days` integer DEFAULT 14 NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assignee_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `plan_oven_idx` ON `maintenance_plan` (`oven_id`);--> statement-breakpoint
CREATE INDEX `plan_assignee_idx` ON `maintenance_plan` (`assignee_id`);--> statement-breakpoint
CREATE INDEX `plan_active_idx` ON `maintenance_plan` (`active`);--> statement-breakpoint
CREATE UNIQUE INDEX `plan_oven_template_unique` ON `maintenance_plan` (`oven_id`,`template_id`);--> statement-breakpoint
CREATE TABLE `meter_reading` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`oven_id` integer NOT NULL,
	`kind` text NOT NULL,
	`value` real NOT NULL,
	`at` integer NOT NULL,
	`recorded_by_id` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `meter_reading_oven_kind_at_idx` ON `meter_reading` (`oven_id`,`kind`,`at`);--> statement-breakpoint
CREATE TABLE `work_order_attachment` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`work_order_id` integer NOT NULL,
	`sha256` text NOT NULL,
	`file_name` text NOT NULL,
	`content_type` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`uploaded_by_id` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_order`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `work_order_attachment_order_idx` ON `work_order_attachment` (`work_order_id`);--> statement-breakpoint
CREATE INDEX `work_order_attachment_sha_idx` ON `work_order_attachment` (`sha256`);--> statement-breakpoint
CREATE TABLE `work_order_comment` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`work_order_id` integer NOT NULL,
	`author_id` text,
	`body` text NOT NULL,
	`mentions` text DEFAULT '[]' NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_order`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `work_order_comment_order_idx` ON `work_order_comment` (`work_order_id`);--> statement-breakpoint
CREATE INDEX `work_order_comment_author_idx` ON `work_order_comment` (`author_id`);--> statement-breakpoint
CREATE TABLE `work_order_part` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`work_order_id` integer NOT NULL,
	`description` text NOT NULL,
	`quantity` real DEFAULT 1 NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_order`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `work_order_part_order_idx` ON `work_order_part` (`work_order_id`);--> statement-breakpoint
CREATE TABLE `work_order` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`number` text NOT NULL,
	`plan_id` integer,
	`occurrence_key` text,
	`oven_id` integer NOT NULL,
	`title` text NOT NULL,
	`kind` text NOT NULL,
	`priority` text DEFAULT 'normal' NOT NULL,
	`state` text DEFAULT 'open' NOT NULL,
	`assignee_id` text,
	`due_at` integer,
	`started_at` integer,
	`completed_at` integer,
	`breakdown` integer DEFAULT false NOT NULL,
	`failure_started_at` integer,
	`checklist` text DEFAULT '[]' NOT NULL,
	`checklist_results` text DEFAULT '{}' NOT NULL,
	`notes` text,
	`labour_minutes` integer,
	`downtime_minutes` integer,
	`safety_lockout` integer DEFAULT false NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`touched` integer DEFAULT false NOT NULL,
	`created_by_id` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`plan_id`) REFERENCES `maintenance_plan`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assignee_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `work_order_number_unique` ON `work_order` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `work_order_plan_occurrence_unique` ON `work_order` (`plan_id`,`occurrence_key`);--> statement-breakpoint
CREATE INDEX `work_order_oven_idx` ON `work_order` (`oven_id`);--> statement-breakpoint
CREATE INDEX `work_order_state_due_idx` ON `work_order` (`state`,`due_at`);--> statement-breakpoint
CREATE INDEX `work_order_assignee_idx` ON `work_order` (`assignee_id`);--> statement-breakpoint
CREATE INDEX `work_order_due_idx` ON `work_order` (`due_at`);--> statement-breakpoint
CREATE INDEX `work_order_kind_idx` ON `work_order` (`kind`);