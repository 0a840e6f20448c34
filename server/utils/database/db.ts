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

// `:name` placeholders as pg's `$n` (a `::type` cast is left alone), worked out once per statement text.
const positional = new Map<string, { text: string, names: string[] }>()
function toPositional(sql: string) {
  let found = positional.get(sql)
  if (!found) {
    const names: string[] = []
    const text = sql.replace(/(?<![:\w]):([A-Za-z_]\w*)/g, (_, name: string) => {
      const at = names.indexOf(name)
      return `$${at < 0 ? names.push(name) : at + 1}`
    })
    found = { text, names }
    if (positional.size < 1000) positional.set(sql, found)
  }
  return found
}

type PooledClient = pg.Client & { _invalid?: boolean }

// A plain SELECT on the hot paths (every request's sign-in check, the car list, the history, the diff and the
// evaluation) straight on a connection of the same pool, with the values sent as parameters: the same rows
// as useDatabase().query(…, { type: SELECT }), without Sequelize's per-query work.
// An array value is one parameter (write `= ANY(:ids)`), not a list.
export async function selectRows<T>(sql: string, replacements: Record<string, unknown> = {}): Promise<T[]> {
  const { text, names } = toPositional(sql)
  const values = names.map((name) => {
    if (!(name in replacements)) throw new Error(`No value for :${name}`)
    return replacements[name]
  })
  const manager = useDatabase().connectionManager
  const connection = await manager.getConnection({ type: 'read' }) as unknown as PooledClient
  try {
    return (await connection.query(text, values)).rows as T[]
  } catch (e) {
    // A statement the server refused leaves the connection usable; anything else (a lost connection) does not.
    if (!(e as { severity?: string }).severity) connection._invalid = true
    throw e
  } finally {
    manager.releaseConnection(connection as never)
  }
}
