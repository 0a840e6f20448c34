import type { MigrationFn } from 'umzug'
import type { QueryInterface } from 'sequelize'

// The evaluation of each profile's on-car version, kept where SQL can filter and sort it for fleet search
// (docs/fleet.md): the figures as columns, the settings as JSONB, the warnings' rules as an array. Written at
// sign-off and by every re-check. Workshops that already have cars are re-checked once on the next start.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE on_car_evaluations (
      "profileId" integer PRIMARY KEY REFERENCES profiles(id),
      "workshopId" integer NOT NULL REFERENCES workshops(id),
      "vehicleId" integer NOT NULL REFERENCES vehicles(id),
      "versionId" integer NOT NULL REFERENCES profile_versions(id),
      settings jsonb NOT NULL,
      "liftOffDecelMs2" double precision, "brakeRegenDecelMs2" double precision,
      "gripDryMs2" double precision, "gripWetMs2" double precision, "gripSnowMs2" double precision,
      "zeroTo50S" double precision, "zeroTo100S" double precision, "topSpeedKph" double precision,
      "maxStartGradePct" double precision, "creepHoldGradePct" double precision,
      "powerRatioToOriginal" double precision, "peakDischargeCurrentA" double precision,
      "liftOffOverSnowGripMs2" double precision GENERATED ALWAYS AS ("liftOffDecelMs2" - "gripSnowMs2") STORED,
      "liftOffOverWetGripMs2" double precision GENERATED ALWAYS AS ("liftOffDecelMs2" - "gripWetMs2") STORED,
      warnings text[] NOT NULL DEFAULT '{}',
      "dangerCount" integer NOT NULL DEFAULT 0,
      "cautionCount" integer NOT NULL DEFAULT 0,
      "evaluatedAt" timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX on_car_evaluations_vehicle ON on_car_evaluations ("vehicleId");
    CREATE INDEX on_car_evaluations_snow ON on_car_evaluations ("workshopId", "liftOffOverSnowGripMs2");
    CREATE INDEX on_car_evaluations_lift_off ON on_car_evaluations ("workshopId", "liftOffDecelMs2");
    CREATE INDEX on_car_evaluations_warnings ON on_car_evaluations USING gin (warnings);
    CREATE INDEX vehicles_driven_axle ON vehicles ("workshopId", (spec->>'drivenAxle'));
    UPDATE workshops SET "rulesRelease" = 0 WHERE EXISTS (SELECT 1 FROM vehicles v WHERE v."workshopId" = workshops.id);
  `)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX vehicles_driven_axle; DROP TABLE on_car_evaluations;')
}
