import { Sequelize } from 'sequelize'
import pg from 'pg'
import { initModels } from '../../models'

let sequelize: Sequelize | undefined

// One connection pool per server instance; the models are initialised on first use.
export function useDatabase(): Sequelize {
  if (!sequelize) {
    sequelize = new Sequelize(useRuntimeConfig().databaseUrl, {
      dialect: 'postgres',
      dialectModule: pg,
      logging: false,
      pool: { max: 10, min: 0, acquire: 10000, idle: 10000 }
    })
    initModels(sequelize)
  }
  return sequelize
}
