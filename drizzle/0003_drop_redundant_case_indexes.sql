DROP INDEX "cases_received_idx";--> statement-breakpoint
DROP INDEX "cases_freq_idx";