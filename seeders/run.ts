import type { Model, ModelStatic, Sequelize, Transaction } from 'sequelize'
import { Umzug, SequelizeStorage } from 'umzug'
import { DemoStory } from './demo-story'
import { seeders } from '.'

// umzug's record of the seeders run, written in the seed run's transaction: a run that fails records nothing.
class SeedRuns extends SequelizeStorage {
  constructor(sequelize: Sequelize, private readonly t: Transaction) {
    super({ sequelize, tableName: 'seed_runs' })
  }

  override async logMigration({ name }: { name: string }) {
    await this.syncModel()
    await (this.model as unknown as ModelStatic<Model>).create({ name }, { transaction: this.t })
  }
}

// The demo data in one transaction: each pending seeder in order, then their history appended in date order
// (seeders/demo-story.ts). Answers the names of the seeders run.
export async function seedDemo(sequelize: Sequelize): Promise<string[]> {
  return sequelize.transaction(async (t) => {
    const story = new DemoStory()
    const umzug = new Umzug({ migrations: seeders, context: { qi: sequelize.getQueryInterface(), t, story }, storage: new SeedRuns(sequelize, t), logger: undefined })
    const done = await umzug.up()
    await story.write(t)
    return done.map(m => m.name)
  })
}
