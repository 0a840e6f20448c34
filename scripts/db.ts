// Database tasks run by `npm start` and `npm test`: `migrate`, `seed`, `down` (one migration back).
import { Sequelize } from 'sequelize'
import pg from 'pg'
import { Umzug, SequelizeStorage } from 'umzug'
import { migrations } from '../migrations'

const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')
const sequelize = new Sequelize(url, { dialect: 'postgres', dialectModule: pg, logging: false })
const context = sequelize.getQueryInterface()

const migrator = new Umzug({ migrations, context, storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }), logger: undefined })

const task = process.argv[2]
try {
  // Several instances may start at once: one migrates, the others wait for it.
  await sequelize.query('SELECT pg_advisory_lock(7300)')
  if (task === 'migrate') {
    const done = await migrator.up()
    console.log(`[voltwright] migrations: ${done.length ? done.map(m => m.name).join(', ') : 'up to date'}`)
  } else if (task === 'seed') {
    const { seedDemo } = await import('../seeders/run')
    const done = await seedDemo(sequelize)
    console.log(`[voltwright] demo data: ${done.length ? done.join(', ') : 'already there'}`)
  } else if (task === 'down') {
    await migrator.down()
  } else {
    throw new Error(`unknown task "${task}": use migrate, seed or down`)
  }
} catch (e) {
  const err = e as Error & { cause?: Error }
  console.error(`[voltwright] database task "${task}" failed: ${err.message}${err.cause ? ` (${err.cause.message})` : ''}`)
  process.exitCode = 1
} finally {
  await sequelize.close()
}
