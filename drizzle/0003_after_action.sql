CREATE TABLE `exercise_findings` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`kind` text NOT NULL,
	`objective_key` text NOT NULL,
	`capability` text NOT NULL,
	`title` text NOT NULL,
	`detail` text DEFAULT '' NOT NULL,
	`created_by` text,
	`updated_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `exercise_findings_exercise_idx` ON `exercise_findings` (`exercise_id`);--> statement-breakpoint
CREATE INDEX `exercise_findings_created_by_idx` ON `exercise_findings` (`created_by`);--> statement-breakpoint
CREATE INDEX `exercise_findings_updated_by_idx` ON `exercise_findings` (`updated_by`);--> statement-breakpoint
CREATE TABLE `feedback_requests` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`user_id` text NOT NULL,
	`sent_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`sent_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `feedback_requests_exercise_idx` ON `feedback_requests` (`exercise_id`);--> statement-breakpoint
CREATE INDEX `feedback_requests_user_idx` ON `feedback_requests` (`user_id`);--> statement-breakpoint
CREATE INDEX `feedback_requests_sent_by_idx` ON `feedback_requests` (`sent_by`);--> statement-breakpoint
CREATE TABLE `feedback_responses` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`user_id` text NOT NULL,
	`ratings` text NOT NULL,
	`went_well` text DEFAULT '' NOT NULL,
	`to_improve` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `feedback_responses_exercise_user_unique` ON `feedback_responses` (`exercise_id`,`user_id`);--> statement-breakpoint
CREATE INDEX `feedback_responses_user_idx` ON `feedback_responses` (`user_id`);--> statement-breakpoint
CREATE TABLE `hotwash_notes` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`section` text NOT NULL,
	`body` text DEFAULT '' NOT NULL,
	`revision` integer DEFAULT 1 NOT NULL,
	`updated_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `hotwash_notes_section_unique` ON `hotwash_notes` (`exercise_id`,`section`);--> statement-breakpoint
CREATE INDEX `hotwash_notes_updated_by_idx` ON `hotwash_notes` (`updated_by`);--> statement-breakpoint
CREATE TABLE `improvement_items` (
	`id` text PRIMARY KEY NOT NULL,
	`exercise_id` text NOT NULL,
	`finding_id` text,
	`objective_key` text NOT NULL,
	`capability` text NOT NULL,
	`action` text NOT NULL,
	`element` text NOT NULL,
	`owner` text NOT NULL,
	`start_date` text NOT NULL,
	`due_date` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`created_by` text,
	`updated_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`exercise_id`) REFERENCES `exercises`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`finding_id`) REFERENCES `exercise_findings`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `improvement_items_exercise_idx` ON `improvement_items` (`exercise_id`);--> statement-breakpoint
CREATE INDEX `improvement_items_finding_idx` ON `improvement_items` (`finding_id`);--> statement-breakpoint
CREATE INDEX `improvement_items_created_by_idx` ON `improvement_items` (`created_by`);--> statement-breakpoint
CREATE INDEX `improvement_items_updated_by_idx` ON `improvement_items` (`updated_by`);