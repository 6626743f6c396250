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
CREATE TABLE `stored_file` (
	`sha256` text PRIMARY KEY NOT NULL,
	`size` integer NOT NULL,
	`media_type` text NOT NULL,
	`path` text NOT NULL,
	`purged_at` integer,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `calibration` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`instrument_id` integer NOT NULL,
	`performed_at` integer NOT NULL,
	`performed_by` text NOT NULL,
	`reference` text NOT NULL,
	`offsets` text NOT NULL,
	`expanded_uncertainty` real,
	`certificate_sha256` text,
	`due_at` integer NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`instrument_id`) REFERENCES `instrument`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`certificate_sha256`) REFERENCES `stored_file`(`sha256`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `calibration_instrument_idx` ON `calibration` (`instrument_id`,`performed_at`);--> statement-breakpoint
CREATE INDEX `calibration_due_idx` ON `calibration` (`due_at`);--> statement-breakpoint
CREATE INDEX `calibration_certificate_idx` ON `calibration` (`certificate_sha256`);--> statement-breakpoint
CREATE TABLE `column_mapping` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`instrument_id` integer NOT NULL,
	`board_id` integer NOT NULL,
	`mapping` text NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`instrument_id`) REFERENCES `instrument`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`board_id`) REFERENCES `test_board`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `column_mapping_unique` ON `column_mapping` (`instrument_id`,`board_id`);--> statement-breakpoint
CREATE INDEX `column_mapping_board_idx` ON `column_mapping` (`board_id`);--> statement-breakpoint
CREATE TABLE `instrument` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`name` text NOT NULL,
	`serial` text NOT NULL,
	`channel_count` integer NOT NULL,
	`scan_skew_seconds` real DEFAULT 0 NOT NULL,
	`resolution` real,
	`accuracy` real,
	`thermocouple_type` text,
	`tolerance_class` text,
	`notes` text,
	`retired_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `instrument_serial_unique` ON `instrument` (`kind`,`serial`);--> statement-breakpoint
CREATE INDEX `instrument_kind_idx` ON `instrument` (`kind`);--> statement-breakpoint
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
CREATE INDEX `work_order_kind_idx` ON `work_order` (`kind`);--> statement-breakpoint
CREATE TABLE `run_channel` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`run_id` integer NOT NULL,
	`position` integer NOT NULL,
	`column` text NOT NULL,
	`probe_label` text NOT NULL,
	`peak` real NOT NULL,
	`time_at_peak` real NOT NULL,
	`tal` real,
	`heat_up_rate` real,
	`ramp_up_max` real,
	`ramp_down_max` real,
	`soak_time` real,
	`time_to_peak` real,
	FOREIGN KEY (`run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `run_channel_run_idx` ON `run_channel` (`run_id`,`position`);--> statement-breakpoint
CREATE TABLE `run_judgement` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`run_id` integer NOT NULL,
	`window_id` integer,
	`window_version` integer,
	`window_values` text NOT NULL,
	`peak_min` real NOT NULL,
	`peak_max` real NOT NULL,
	`delta_t_peak` real NOT NULL,
	`critical_spread` real,
	`heat_up_rate` real,
	`ramp_up_max` real,
	`ramp_down_max` real,
	`soak_time_min` real,
	`soak_time_max` real,
	`tal_min` real,
	`tal_max` real,
	`time_to_peak_max` real,
	`verdict_status` text NOT NULL,
	`window_use` real,
	`verdict_items` text NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`window_id`) REFERENCES `process_window`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `run_judgement_run_idx` ON `run_judgement` (`run_id`);--> statement-breakpoint
CREATE INDEX `run_judgement_window_idx` ON `run_judgement` (`window_id`);--> statement-breakpoint
CREATE TABLE `run_sample` (
	`run_id` integer PRIMARY KEY NOT NULL,
	`rows` integer NOT NULL,
	`channels` integer NOT NULL,
	`time` blob NOT NULL,
	`values` blob NOT NULL,
	FOREIGN KEY (`run_id`) REFERENCES `run`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `run` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`oven_id` integer NOT NULL,
	`run_at` integer NOT NULL,
	`window_id` integer,
	`window_version` integer,
	`window_values` text NOT NULL,
	`board_id` integer,
	`instrument_id` integer,
	`calibration_id` integer,
	`calibration_status` text NOT NULL,
	`skew_seconds` real DEFAULT 0 NOT NULL,
	`offsets_applied` text NOT NULL,
	`file_sha256` text,
	`file_name` text,
	`start_state` text,
	`conveyor_speed` real,
	`set_points` text,
	`operator` text,
	`notes` text,
	`rows` integer NOT NULL,
	`duration_seconds` real NOT NULL,
	`sample_interval` real NOT NULL,
	`units` text NOT NULL,
	`warnings` text NOT NULL,
	`peak_min` real NOT NULL,
	`peak_max` real NOT NULL,
	`delta_t_peak` real NOT NULL,
	`critical_spread` real,
	`heat_up_rate` real,
	`ramp_up_max` real,
	`ramp_down_max` real,
	`soak_time_min` real,
	`soak_time_max` real,
	`tal_min` real,
	`tal_max` real,
	`time_to_peak_max` real,
	`verdict_status` text NOT NULL,
	`window_use` real,
	`verdict_items` text NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	`deleted_at` integer,
	FOREIGN KEY (`oven_id`) REFERENCES `oven`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`window_id`) REFERENCES `process_window`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`board_id`) REFERENCES `test_board`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`instrument_id`) REFERENCES `instrument`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`calibration_id`) REFERENCES `calibration`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`file_sha256`) REFERENCES `stored_file`(`sha256`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `run_oven_time_idx` ON `run` (`oven_id`,`run_at`);--> statement-breakpoint
CREATE INDEX `run_time_idx` ON `run` (`run_at`);--> statement-breakpoint
CREATE INDEX `run_window_idx` ON `run` (`window_id`);--> statement-breakpoint
CREATE INDEX `run_board_idx` ON `run` (`board_id`);--> statement-breakpoint
CREATE INDEX `run_instrument_idx` ON `run` (`instrument_id`,`run_at`);--> statement-breakpoint
CREATE INDEX `run_calibration_idx` ON `run` (`calibration_id`);--> statement-breakpoint
CREATE INDEX `run_verdict_idx` ON `run` (`verdict_status`,`run_at`);--> statement-breakpoint
CREATE INDEX `run_file_idx` ON `run` (`file_sha256`);--> statement-breakpoint
CREATE INDEX `run_created_by_idx` ON `run` (`created_by`);--> statement-breakpoint
CREATE TABLE `process_window_version` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`window_id` integer NOT NULL,
	`version` integer NOT NULL,
	`values` text NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`window_id`) REFERENCES `process_window`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `process_window_version_unique` ON `process_window_version` (`window_id`,`version`);--> statement-breakpoint
CREATE TABLE `process_window` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`preset_id` text,
	`version` integer DEFAULT 1 NOT NULL,
	`values` text NOT NULL,
	`notes` text,
	`archived_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `process_window_name_unique` ON `process_window` (`name`);--> statement-breakpoint
CREATE TABLE `test_board` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`width_mm` real NOT NULL,
	`height_mm` real NOT NULL,
	`probes` text NOT NULL,
	`picture_sha256` text,
	`notes` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`picture_sha256`) REFERENCES `stored_file`(`sha256`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `test_board_name_unique` ON `test_board` (`name`);--> statement-breakpoint
CREATE INDEX `test_board_picture_idx` ON `test_board` (`picture_sha256`);--> statement-breakpoint
ALTER TABLE `oven` ADD `default_window_id` integer REFERENCES process_window(id);--> statement-breakpoint
ALTER TABLE `oven` ADD `default_board_id` integer REFERENCES test_board(id);--> statement-breakpoint
CREATE INDEX `oven_default_window_idx` ON `oven` (`default_window_id`);--> statement-breakpoint
CREATE INDEX `oven_default_board_idx` ON `oven` (`default_board_id`);--> statement-breakpoint
ALTER TABLE `user` ADD `time_zone` text DEFAULT 'Europe/Dublin' NOT NULL;