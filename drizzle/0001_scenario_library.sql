CREATE TABLE `exercise_attachments` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`path` text NOT NULL,
	`name` text NOT NULL,
	`content_type` text NOT NULL,
	`size` integer NOT NULL,
	`sha256` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `exercise_attachments_path_unique` ON `exercise_attachments` (`exercise_id`,`path`);--> statement-breakpoint
CREATE TABLE `scenario_attachments` (
	`id` text PRIMARY KEY NOT NULL,
	`scenario_id` text NOT NULL,
	`path` text NOT NULL,
	`name` text NOT NULL,
	`content_type` text NOT NULL,
	`size` integer NOT NULL,
	`sha256` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `scenario_attachments_path_unique` ON `scenario_attachments` (`scenario_id`,`path`);--> statement-breakpoint
CREATE TABLE `scenarios` (
	`id` text PRIMARY KEY NOT NULL,
	`key` text NOT NULL,
	`title` text NOT NULL,
	`document` text NOT NULL,
	`revision` integer DEFAULT 1 NOT NULL,
	`origin` text NOT NULL,
	`created_by` text,
	`updated_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `scenarios_key_unique` ON `scenarios` (`key`);--> statement-breakpoint
CREATE INDEX `scenarios_created_by_idx` ON `scenarios` (`created_by`);--> statement-breakpoint
CREATE INDEX `scenarios_updated_by_idx` ON `scenarios` (`updated_by`);--> statement-breakpoint
ALTER TABLE `exercises` ADD `scenario_id` text REFERENCES scenarios(id) ON DELETE set null;--> statement-breakpoint
ALTER TABLE `exercises` ADD `scenario` text;--> statement-breakpoint
CREATE INDEX `exercises_scenario_idx` ON `exercises` (`scenario_id`);--> statement-breakpoint
ALTER TABLE `users` ADD `can_author` integer DEFAULT false NOT NULL;