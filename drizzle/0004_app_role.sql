-- Two database roles. The role that runs migrations owns every object; the application runs as
-- a login role that is a member of the group role quietband_app, which holds only the grants
-- below: no ownership, no DDL, no TRUNCATE anywhere, no UPDATE/DELETE on append-only tables.
-- The group is cluster-wide; ops/db.sh creates it for the project-local cluster. Elsewhere this
-- migration creates it when the migrating role may (CREATEROLE), or says what to run.
DO $$
BEGIN
  IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = 'quietband_app') THEN
    BEGIN
      CREATE ROLE quietband_app NOLOGIN;
    EXCEPTION WHEN insufficient_privilege THEN
      RAISE EXCEPTION 'The group role quietband_app does not exist and % may not create it.', current_user
        USING HINT = 'As an administrator run once: CREATE ROLE quietband_app NOLOGIN; GRANT quietband_app TO <the app''s login role>;';
    END;
  END IF;
END
$$;--> statement-breakpoint
DO $$
BEGIN
  EXECUTE format('GRANT CONNECT, TEMPORARY ON DATABASE %I TO quietband_app', current_database());
  -- databases made from an old template may still let everyone create in public
  BEGIN
    REVOKE CREATE ON SCHEMA public FROM PUBLIC;
  EXCEPTION WHEN insufficient_privilege THEN
    RAISE WARNING 'could not revoke CREATE on schema public from PUBLIC; ask the database owner to';
  END;
END
$$;--> statement-breakpoint
GRANT USAGE ON SCHEMA public TO quietband_app;--> statement-breakpoint
GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO quietband_app;--> statement-breakpoint
GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO quietband_app;--> statement-breakpoint
-- tables and sequences made by later migrations (run by this same role) get the same grants
ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO quietband_app;--> statement-breakpoint
ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO quietband_app;--> statement-breakpoint

-- Refuses any change to a row of an append-only table (installed by make_append_only).
CREATE FUNCTION quietband_refuse_change() RETURNS trigger LANGUAGE plpgsql
SET search_path = pg_catalog, pg_temp AS $$
BEGIN
  RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;--> statement-breakpoint

-- Sets the row's time column (TG_ARGV[0]) to the database's time, whatever the insert says.
-- Only the table's owner (migrations and the ops tools that tell demo stories on their own
-- clock) keeps the time it gives.
CREATE FUNCTION quietband_server_time() RETURNS trigger LANGUAGE plpgsql
SET search_path = pg_catalog, pg_temp AS $$
BEGIN
  IF NOT pg_has_role(current_user, (SELECT relowner FROM pg_class WHERE oid = TG_RELID), 'USAGE') THEN
    NEW := jsonb_populate_record(NEW, jsonb_build_object(TG_ARGV[0], now()));
  END IF;
  RETURN NEW;
END
$$;--> statement-breakpoint

-- make_append_only(table, time column): the one way a table becomes an append-only record
-- (timeline, calculation records, custody log, issued case files). Installs the triggers that
-- refuse UPDATE, DELETE and TRUNCATE (for every role, owner included, until the owner drops
-- them in a migration), the trigger that sets the time column from the database's clock, and
-- leaves the application only SELECT and INSERT. Idempotent.
CREATE FUNCTION make_append_only(tbl regclass, time_column text) RETURNS void LANGUAGE plpgsql
SET search_path = pg_catalog, public, pg_temp AS $$
DECLARE
  rel text := (SELECT relname FROM pg_class WHERE oid = tbl);
BEGIN
  IF NOT EXISTS (
    SELECT FROM pg_attribute
    WHERE attrelid = tbl AND attname = time_column AND NOT attisdropped AND atttypid = 'timestamptz'::regtype
  ) THEN
    RAISE EXCEPTION 'make_append_only: % has no timestamptz column %', tbl, time_column;
  END IF;
  EXECUTE format('CREATE OR REPLACE TRIGGER %I BEFORE UPDATE OR DELETE ON %s FOR EACH ROW EXECUTE FUNCTION quietband_refuse_change()', rel || '_append_only', tbl);
  EXECUTE format('CREATE OR REPLACE TRIGGER %I BEFORE TRUNCATE ON %s FOR EACH STATEMENT EXECUTE FUNCTION quietband_refuse_change()', rel || '_no_truncate', tbl);
  EXECUTE format('CREATE OR REPLACE TRIGGER %I BEFORE INSERT ON %s FOR EACH ROW EXECUTE FUNCTION quietband_server_time(%L)', rel || '_server_time', tbl, time_column);
  EXECUTE format('REVOKE ALL ON %s FROM PUBLIC', tbl);
  EXECUTE format('REVOKE ALL ON %s FROM quietband_app', tbl);
  EXECUTE format('GRANT SELECT, INSERT ON %s TO quietband_app', tbl);
END
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION make_append_only(regclass, text) FROM PUBLIC;--> statement-breakpoint

-- The timeline: the triggers of 0001 are replaced by the shared ones.
SELECT make_append_only('case_events', 'at');--> statement-breakpoint
DROP FUNCTION case_events_refuse_change();--> statement-breakpoint

-- At commit, refuses the application's deletion of a job that is still waiting or running,
-- unless the same job (same id, same data) is back by then: pg-boss fails and retries a job by
-- deleting it and inserting it again, and archives finished or expired jobs by deleting them.
CREATE FUNCTION quietband_job_kept() RETURNS trigger LANGUAGE plpgsql
SET search_path = pg_catalog, pg_temp AS $$
BEGIN
  IF pg_has_role(current_user, (SELECT relowner FROM pg_class WHERE oid = TG_RELID), 'USAGE') THEN
    RETURN NULL;
  END IF;
  IF OLD.state::text IN ('completed', 'cancelled', 'failed') OR (OLD.state::text IN ('created', 'retry') AND OLD.keep_until < now()) THEN
    RETURN NULL;
  END IF;
  IF EXISTS (SELECT FROM pgboss.job j WHERE j.name = OLD.name AND j.id = OLD.id AND j.data IS NOT DISTINCT FROM OLD.data) THEN
    RETURN NULL;
  END IF;
  RAISE EXCEPTION 'job % of queue % is still queued: the application may not delete it', OLD.id, OLD.name
    USING ERRCODE = 'insufficient_privilege';
END
$$;--> statement-breakpoint

-- quietband_secure_job_queue(): run by the owner after pg-boss has created or migrated its
-- schema (server/db/roles.ts does it at every start; idempotent). The application may send,
-- fetch, complete, fail and archive jobs; queues are created through pg-boss's create_queue,
-- which runs with the owner's rights; nothing else in the schema is the application's.
CREATE FUNCTION quietband_secure_job_queue() RETURNS void LANGUAGE plpgsql
SET search_path = pg_catalog, public, pg_temp AS $$
BEGIN
  IF to_regclass('pgboss.job') IS NULL THEN
    RAISE EXCEPTION 'the job queue (schema pgboss) is not installed yet';
  END IF;
  REVOKE ALL ON SCHEMA pgboss FROM PUBLIC;
  GRANT USAGE ON SCHEMA pgboss TO quietband_app;
  REVOKE ALL ON ALL TABLES IN SCHEMA pgboss FROM PUBLIC, quietband_app;
  REVOKE ALL ON ALL FUNCTIONS IN SCHEMA pgboss FROM PUBLIC, quietband_app;
  GRANT SELECT, INSERT, DELETE ON pgboss.job, pgboss.archive TO quietband_app;
  GRANT UPDATE (state, started_on, retry_count, retry_limit, start_after, completed_on, output) ON pgboss.job TO quietband_app;
  GRANT SELECT ON pgboss.queue TO quietband_app;
  GRANT SELECT, UPDATE (maintained_on, monitored_on, cron_on) ON pgboss.version TO quietband_app;
  GRANT SELECT, INSERT, UPDATE, DELETE ON pgboss.schedule, pgboss.subscription TO quietband_app;
  ALTER FUNCTION pgboss.create_queue(text, json) SECURITY DEFINER SET search_path = pg_catalog, pgboss, pg_temp;
  GRANT EXECUTE ON FUNCTION pgboss.create_queue(text, json) TO quietband_app;
  IF NOT EXISTS (SELECT FROM pg_trigger WHERE tgrelid = 'pgboss.job'::regclass AND tgname = 'job_kept') THEN
    CREATE CONSTRAINT TRIGGER job_kept AFTER DELETE ON pgboss.job DEFERRABLE INITIALLY DEFERRED
      FOR EACH ROW EXECUTE FUNCTION quietband_job_kept();
  END IF;
END
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION quietband_secure_job_queue() FROM PUBLIC;
