import type { MigrationFn } from 'umzug'
import type { QueryInterface } from 'sequelize'
import { morePlatforms } from '../shared/platforms'

// Three more shared drive units whose controllers have settings of their own (amps, hp and mph, switches,
// modes and a throttle map); a key already there is left alone.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const p of morePlatforms) {
    await qi.sequelize.query(
      `INSERT INTO platforms (key, name, "motorMaxRpm", "torqueConstantNmPerA", schema, "createdAt", "updatedAt")
       SELECT :key, :name, :motorMaxRpm, :torqueConstantNmPerA, CAST(:schema AS jsonb), now(), now()
        WHERE NOT EXISTS (SELECT 1 FROM platforms WHERE key = :key AND "workshopId" IS NULL)`,
      { replacements: { key: p.key, name: p.name, motorMaxRpm: p.motorMaxRpm, torqueConstantNmPerA: p.torqueConstantNmPerA ?? null, schema: JSON.stringify(p.schema) } })
  }
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DELETE FROM platforms p WHERE key IN (:keys) AND "workshopId" IS NULL AND NOT EXISTS (SELECT 1 FROM vehicles v WHERE v."platformId" = p.id)',
    { replacements: { keys: morePlatforms.map(p => p.key) } })
}
