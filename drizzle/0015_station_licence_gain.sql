ALTER TABLE "authorised_stations" ADD COLUMN "antenna_gain_dbi" double precision;--> statement-breakpoint
ALTER TABLE "authorised_stations" ADD COLUMN "feeder_loss_db" double precision;--> statement-breakpoint
ALTER TABLE "authorised_stations" ADD CONSTRAINT "authorised_stations_feeder_loss" CHECK ("authorised_stations"."feeder_loss_db" is null or "authorised_stations"."feeder_loss_db" >= 0);