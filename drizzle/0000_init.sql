CREATE TABLE `assemblies` (
	`id` int AUTO_INCREMENT NOT NULL,
	`job_id` int NOT NULL,
	`name` varchar(160) NOT NULL,
	`element` enum('wall','roof','floor') NOT NULL DEFAULT 'wall',
	`description` text NOT NULL DEFAULT (''),
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `assemblies_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` int AUTO_INCREMENT NOT NULL,
	`team_id` int,
	`actor_id` varchar(255),
	`action` varchar(64) NOT NULL,
	`target` varchar(255) NOT NULL DEFAULT '',
	`detail` longtext,
	`ip` varchar(64) NOT NULL DEFAULT '',
	`success` boolean NOT NULL DEFAULT true,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `comments` (
	`id` int AUTO_INCREMENT NOT NULL,
	`revision_id` int NOT NULL,
	`author_id` varchar(255),
	`body` text NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `comments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `email_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`purpose` enum('verify','reset') NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `email_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `email_tokens_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` int AUTO_INCREMENT NOT NULL,
	`team_id` int NOT NULL,
	`email` varchar(255) NOT NULL,
	`role` enum('admin','engineer','checker') NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`invited_by` varchar(255),
	`expires_at` datetime(3) NOT NULL,
	`accepted_at` datetime(3),
	`revoked_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `invitations_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitations_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`team_id` int NOT NULL,
	`name` varchar(160) NOT NULL,
	`reference` varchar(60) NOT NULL DEFAULT '',
	`client` varchar(160) NOT NULL DEFAULT '',
	`location` varchar(160) NOT NULL DEFAULT '',
	`notes` text NOT NULL DEFAULT (''),
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `jobs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `materials` (
	`id` int AUTO_INCREMENT NOT NULL,
	`team_id` int,
	`builtin_key` varchar(80),
	`name` varchar(160) NOT NULL,
	`material_class` enum('masonry','concrete','timber','insulation','board','metal','membrane','air','render') NOT NULL,
	`conductivity` double NOT NULL,
	`density` double NOT NULL,
	`specific_heat` double NOT NULL,
	`vapour_resistance_factor` double NOT NULL,
	`source` text NOT NULL,
	`notes` text NOT NULL DEFAULT (''),
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `materials_id` PRIMARY KEY(`id`),
	CONSTRAINT `materials_builtin_uq` UNIQUE(`builtin_key`)
);
--> statement-breakpoint
CREATE TABLE `memberships` (
	`team_id` int NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`role` enum('admin','engineer','checker') NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `memberships_team_id_user_id_pk` PRIMARY KEY(`team_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `outbound_mail` (
	`id` int AUTO_INCREMENT NOT NULL,
	`to_address` varchar(255) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`purpose` varchar(40) NOT NULL,
	`status` enum('sent','failed') NOT NULL,
	`message_id` varchar(255),
	`error` text,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `outbound_mail_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `revision_events` (
	`id` int AUTO_INCREMENT NOT NULL,
	`revision_id` int NOT NULL,
	`from_state` enum('draft','in_check','checked','sent_back','issued'),
	`to_state` enum('draft','in_check','checked','sent_back','issued') NOT NULL,
	`actor_id` varchar(255),
	`note` text NOT NULL DEFAULT (''),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `revision_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `revisions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`assembly_id` int NOT NULL,
	`number` int NOT NULL,
	`parent_id` int,
	`model` longtext NOT NULL,
	`note` text NOT NULL DEFAULT (''),
	`state` enum('draft','in_check','checked','sent_back','issued') NOT NULL DEFAULT 'draft',
	`author_id` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `revisions_assembly_number_uq` UNIQUE(`assembly_id`,`number`)
);
--> statement-breakpoint
CREATE TABLE `runs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`revision_id` int NOT NULL,
	`exposure` longtext NOT NULL,
	`summary` longtext NOT NULL,
	`series` longtext,
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `runs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` varchar(255) NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`expires_at` datetime NOT NULL,
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `share_links` (
	`id` int AUTO_INCREMENT NOT NULL,
	`revision_id` int NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`label` varchar(160) NOT NULL DEFAULT '',
	`created_by` varchar(255),
	`expires_at` datetime(3),
	`revoked_at` datetime(3),
	`last_opened_at` datetime(3),
	`open_count` int NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `share_links_id` PRIMARY KEY(`id`),
	CONSTRAINT `share_links_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `smtp_inbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`envelope_from` varchar(255) NOT NULL,
	`envelope_to` varchar(1000) NOT NULL,
	`subject` varchar(255) NOT NULL DEFAULT '',
	`text_body` text NOT NULL,
	`html_body` text,
	`raw` text NOT NULL,
	`received_at` datetime(3) NOT NULL,
	CONSTRAINT `smtp_inbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `teams` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `teams_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `uploads` (
	`id` int AUTO_INCREMENT NOT NULL,
	`team_id` int NOT NULL,
	`name` varchar(160) NOT NULL,
	`file_name` varchar(255) NOT NULL,
	`mapping` longtext NOT NULL,
	`series` longtext NOT NULL,
	`row_count` int NOT NULL,
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `uploads_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` varchar(255) NOT NULL,
	`email` varchar(255) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`email_verified_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_uq` UNIQUE(`email`)
);
--> statement-breakpoint
ALTER TABLE `assemblies` ADD CONSTRAINT `assemblies_job_id_jobs_id_fk` FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `assemblies` ADD CONSTRAINT `assemblies_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `email_tokens` ADD CONSTRAINT `email_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_invited_by_users_id_fk` FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `jobs` ADD CONSTRAINT `jobs_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `jobs` ADD CONSTRAINT `jobs_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `materials` ADD CONSTRAINT `materials_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `materials` ADD CONSTRAINT `materials_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `memberships` ADD CONSTRAINT `memberships_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `memberships` ADD CONSTRAINT `memberships_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revision_events` ADD CONSTRAINT `revision_events_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revision_events` ADD CONSTRAINT `revision_events_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revisions` ADD CONSTRAINT `revisions_assembly_id_assemblies_id_fk` FOREIGN KEY (`assembly_id`) REFERENCES `assemblies`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revisions` ADD CONSTRAINT `revisions_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `runs` ADD CONSTRAINT `runs_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_links` ADD CONSTRAINT `share_links_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_links` ADD CONSTRAINT `share_links_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `uploads` ADD CONSTRAINT `uploads_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `uploads` ADD CONSTRAINT `uploads_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `assemblies_job_idx` ON `assemblies` (`job_id`);--> statement-breakpoint
CREATE INDEX `audit_team_idx` ON `audit_log` (`team_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `comments_revision_idx` ON `comments` (`revision_id`);--> statement-breakpoint
CREATE INDEX `invitations_team_idx` ON `invitations` (`team_id`);--> statement-breakpoint
CREATE INDEX `jobs_team_idx` ON `jobs` (`team_id`);--> statement-breakpoint
CREATE INDEX `materials_team_idx` ON `materials` (`team_id`);--> statement-breakpoint
CREATE INDEX `memberships_user_idx` ON `memberships` (`user_id`);--> statement-breakpoint
CREATE INDEX `revision_events_revision_idx` ON `revision_events` (`revision_id`);--> statement-breakpoint
CREATE INDEX `runs_revision_idx` ON `runs` (`revision_id`);--> statement-breakpoint
CREATE INDEX `share_links_revision_idx` ON `share_links` (`revision_id`);--> statement-breakpoint
CREATE INDEX `smtp_inbox_to_idx` ON `smtp_inbox` (`envelope_to`);--> statement-breakpoint
CREATE INDEX `uploads_team_idx` ON `uploads` (`team_id`);