import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// A person's session epoch goes up when their password changes or they are deactivated: every session signed
// in under an earlier epoch stops working at once (docs/security.md). Sign-in delays look failures up by e-mail.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('users', 'sessionEpoch', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 })
  await qi.addIndex('login_attempts', ['email', 'createdAt'], { name: 'login_attempts_email_created' })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex('login_attempts', 'login_attempts_email_created')
  await qi.removeColumn('users', 'sessionEpoch')
}
