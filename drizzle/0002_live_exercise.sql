CREATE TABLE `exercise_clocks` (
	`exercise_id` text PRIMARY KEY NOT NULL,
	`wall_anchor` integer NOT NULL,
	`scenario_anchor` integer NOT NULL,
	`factor` real NOT NULL,
	`paused` integer NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `exercise_events` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`seq` integer NOT NULL,
	`type` text NOT NULL,
	`wall_time` integer NOT NULL,
	`scenario_time` integer NOT NULL,
	`actor_id` text,
	`audience` text NOT NULL,
	`payload` text NOT NULL,
	`idempotency_key` text,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `exercise_events_seq_unique` ON `exercise_events` (`exercise_id`,`seq`);--> statement-breakpoint
CREATE UNIQUE INDEX `exercise_events_idempotency_unique` ON `exercise_events` (`exercise_id`,`actor_id`,`idempotency_key`);--> statement-breakpoint
CREATE INDEX `exercise_events_actor_idx` ON `exercise_events` (`actor_id`);--> statement-breakpoint
CREATE TABLE `exercise_injects` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`inject_key` text NOT NULL,
	`status` text NOT NULL,
	`definition` text,
	`released_seq` integer,
	`solution_key` text,
	`body` text,
	`revision` integer DEFAULT 0 NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `exercise_injects_key_unique` ON `exercise_injects` (`exercise_id`,`inject_key`);--> statement-breakpoint
CREATE TABLE `exercise_solutions` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`solution_key` text NOT NULL,
	`seq` integer NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `exercise_solutions_key_unique` ON `exercise_solutions` (`exercise_id`,`solution_key`);--> statement-breakpoint
CREATE TABLE `wall_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`token_hash` text NOT NULL,
	`label` text DEFAULT '' NOT NULL,
	`created_by` text,
	`revoked_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `wall_tokens_hash_unique` ON `wall_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `wall_tokens_exercise_idx` ON `wall_tokens` (`exercise_id`);--> statement-breakpoint
CREATE INDEX `wall_tokens_created_by_idx` ON `wall_tokens` (`created_by`);