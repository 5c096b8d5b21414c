CREATE TABLE `rate_limits` (
	`key` varchar(255) NOT NULL,
	`points` int NOT NULL DEFAULT 0,
	`expire` bigint unsigned,
	CONSTRAINT `rate_limits_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `outbound_mail` MODIFY COLUMN `status` enum('queued','sent','failed') NOT NULL;--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `text_body` text DEFAULT ('') NOT NULL;--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `html_body` text;--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `attempts` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `next_attempt_at` datetime(3) NOT NULL;--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `locked_until` datetime(3);--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `lock_id` varchar(32);--> statement-breakpoint
ALTER TABLE `outbound_mail` ADD `sent_at` datetime(3);--> statement-breakpoint
CREATE INDEX `outbound_mail_due_idx` ON `outbound_mail` (`status`,`next_attempt_at`);