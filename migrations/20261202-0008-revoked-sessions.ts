import type { MigrationFn } from 'umzug'
import { DataTypes, type QueryInterface } from 'sequelize'

// Sessions live in the sealed cookie; signing out lists the session here, so a copy of its cookie no longer
// opens anything. A row is needed only until the session would have expired anyway.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('revoked_sessions', {
    sessionId: { type: DataTypes.TEXT, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    revokedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    expiresAt: { type: DataTypes.DATE, allowNull: false }
  })
  await qi.addIndex('revoked_sessions', ['expiresAt'], { name: 'revoked_sessions_expiry' })
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('revoked_sessions')
}
