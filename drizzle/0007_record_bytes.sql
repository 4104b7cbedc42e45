ALTER TABLE `exercises` ADD `record_bytes` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
UPDATE `exercises` SET `record_bytes` = coalesce((SELECT sum(length(CAST(`payload` AS BLOB))) FROM `exercise_events` WHERE `exercise_events`.`exercise_id` = `exercises`.`id` AND `exercise_events`.`type` IN ('response.submitted', 'observation.recorded', 'score.recorded', 'message.sent')), 0);
