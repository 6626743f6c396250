DROP INDEX `run_verdict_idx`;--> statement-breakpoint
CREATE INDEX `run_live_time_idx` ON `run` (`run_at`,`id`) WHERE deleted_at is null;--> statement-breakpoint
CREATE INDEX `run_oven_live_idx` ON `run` (`oven_id`,`run_at`,`delta_t_peak`) WHERE deleted_at is null;--> statement-breakpoint
CREATE INDEX `run_verdict_idx` ON `run` (`verdict_status`,`run_at`) WHERE deleted_at is null;--> statement-breakpoint
ALTER TABLE `oven_health` ADD `run_summary` text;--> statement-breakpoint
CREATE INDEX `work_order_list_order_idx` ON `work_order` ((due_at is null),`due_at`,`id`);