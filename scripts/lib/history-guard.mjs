// Who may rewrite the audit history: nobody the server connects as. Run as the database superuser.
//
// audit_events belongs to a role nobody signs in as (voltwright_history); the application's role holds only
// SELECT and INSERT on it, so it can neither UPDATE, DELETE or TRUNCATE rows (privilege, and the trigger
// behind it) nor disable or drop the trigger (only the owner may). Because the application's role owns the
// database, and so the public schema, it could still DROP the table or its trigger function; an event
// trigger owned by the superuser refuses that. Migrations run with the owner's rights for their duration
// only (openHistoryForMigrations), and protectHistory takes them back afterwards.
import { psql } from './postgres.mjs'

const OWNER = 'voltwright_history'
const APP = 'voltwright'
const DB = 'voltwright'

const roleExists = `SELECT 1 FROM pg_roles WHERE rolname = '${OWNER}'`

export function openHistoryForMigrations(port) {
  if (psql(port, roleExists, DB)) psql(port, `GRANT ${OWNER} TO ${APP}`, DB)
}

export function protectHistory(port) {
  psql(port, `
    DO $$ BEGIN
      IF NOT EXISTS (${roleExists}) THEN CREATE ROLE ${OWNER} NOLOGIN; END IF;
      IF EXISTS (SELECT 1 FROM pg_auth_members m JOIN pg_roles r ON r.oid = m.roleid JOIN pg_roles a ON a.oid = m.member
                 WHERE r.rolname = '${OWNER}' AND a.rolname = '${APP}') THEN
        REVOKE ${OWNER} FROM ${APP};
      END IF;
      IF to_regclass('public.audit_events') IS NOT NULL THEN
        ALTER TABLE public.audit_events OWNER TO ${OWNER};
        ALTER FUNCTION public.audit_events_refuse_change() OWNER TO ${OWNER};
        REVOKE ALL ON public.audit_events FROM ${APP};
        GRANT SELECT, INSERT ON public.audit_events TO ${APP};
        REVOKE ALL ON SEQUENCE public.audit_events_id_seq FROM ${APP};
        GRANT USAGE ON SEQUENCE public.audit_events_id_seq TO ${APP};
      END IF;
    END $$;
    CREATE SCHEMA IF NOT EXISTS history_guard AUTHORIZATION postgres;
    CREATE OR REPLACE FUNCTION history_guard.refuse_history_drop() RETURNS event_trigger LANGUAGE plpgsql AS $fn$
    DECLARE obj record;
    BEGIN
      IF (SELECT rolsuper FROM pg_roles WHERE rolname = session_user) THEN RETURN; END IF;
      FOR obj IN SELECT * FROM pg_event_trigger_dropped_objects() LOOP
        IF obj.object_identity IN ('public.audit_events', 'public.audit_events_refuse_change()', 'public.audit_events_id_seq')
           OR (obj.object_type = 'trigger' AND obj.object_identity LIKE '% on public.audit_events')
           OR obj.schema_name = 'history_guard' THEN
          RAISE EXCEPTION 'the audit history cannot be dropped: % refused', obj.object_identity USING ERRCODE = 'insufficient_privilege';
        END IF;
      END LOOP;
    END $fn$;
    DROP EVENT TRIGGER IF EXISTS voltwright_keep_history;
    CREATE EVENT TRIGGER voltwright_keep_history ON sql_drop EXECUTE FUNCTION history_guard.refuse_history_drop();
  `, DB)
}
