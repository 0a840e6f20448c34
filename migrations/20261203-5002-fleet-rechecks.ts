import type { MigrationFn } from 'umzug'
import type { QueryInterface } from 'sequelize'

// Re-checks of a workshop's cars in the background: one row per run, one per car, claimed by any server
// instance with FOR UPDATE SKIP LOCKED (docs/fleet.md). Each workshop remembers the rules release its cars
// were last checked against, so a new release re-checks them once however many instances start.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE workshops ADD COLUMN "rulesRelease" integer NOT NULL DEFAULT 1;
    CREATE TABLE fleet_rechecks (
      id serial PRIMARY KEY,
      "workshopId" integer NOT NULL REFERENCES workshops(id),
      reason text NOT NULL CHECK (reason IN ('thresholds', 'drive-unit', 'rules', 'asked')),
      detail jsonb NOT NULL DEFAULT '{}',
      "rulesRelease" integer NOT NULL,
      state text NOT NULL DEFAULT 'running' CHECK (state IN ('running', 'done', 'superseded')),
      total integer NOT NULL DEFAULT 0,
      done integer NOT NULL DEFAULT 0,
      "requestedById" integer REFERENCES users(id),
      "createdAt" timestamptz NOT NULL DEFAULT now(),
      "finishedAt" timestamptz
    );
    CREATE INDEX fleet_rechecks_latest ON fleet_rechecks ("workshopId", id DESC);
    CREATE INDEX fleet_rechecks_running ON fleet_rechecks (id) WHERE state = 'running';
    CREATE TABLE fleet_recheck_items (
      id bigserial PRIMARY KEY,
      "recheckId" integer NOT NULL REFERENCES fleet_rechecks(id),
      "workshopId" integer NOT NULL REFERENCES workshops(id),
      "vehicleId" integer NOT NULL REFERENCES vehicles(id),
      "versionId" integer NOT NULL REFERENCES profile_versions(id),
      state text NOT NULL DEFAULT 'pending' CHECK (state IN ('pending', 'done', 'skipped')),
      "newWarnings" jsonb,
      "newWarningCount" integer NOT NULL DEFAULT 0,
      "worstRank" integer NOT NULL DEFAULT 0,
      "checkedAt" timestamptz
    );
    CREATE INDEX fleet_recheck_items_pending ON fleet_recheck_items (id) WHERE state = 'pending';
    CREATE INDEX fleet_recheck_items_worst ON fleet_recheck_items ("recheckId", "worstRank" DESC, "newWarningCount" DESC) WHERE "worstRank" > 0;
  `)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE fleet_recheck_items; DROP TABLE fleet_rechecks; ALTER TABLE workshops DROP COLUMN "rulesRelease";')
}
