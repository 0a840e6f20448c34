import type { MigrationFn } from 'umzug'
import { DataTypes, literal, type QueryInterface } from 'sequelize'

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true }
const stamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
  updatedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
}
const ref = (table: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model: table, key: 'id' } })

// Profiles, their numbered versions and the four-eyes reviews; the database itself keeps version numbers
// gap-free and a version's content frozen once it has left draft.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('profiles', {
    id,
    workshopId: ref('workshops'),
    vehicleId: ref('vehicles'),
    name: { type: DataTypes.TEXT, allowNull: false },
    onCarVersionId: { type: DataTypes.INTEGER, allowNull: true },
    ...stamps
  })
  await qi.addIndex('profiles', ['vehicleId', 'name'], { unique: true })
  await qi.createTable('profile_versions', {
    id,
    workshopId: ref('workshops'),
    profileId: ref('profiles'),
    versionNo: { type: DataTypes.INTEGER, allowNull: false },
    parentVersionId: ref('profile_versions', true),
    parameters: { type: DataTypes.JSONB, allowNull: false },
    rationale: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    authorId: ref('users'),
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    origin: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'workshop' },
    roadTestId: { type: DataTypes.INTEGER, allowNull: true },
    evaluation: { type: DataTypes.JSONB, allowNull: true },
    justifications: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    contentHash: { type: DataTypes.TEXT, allowNull: false },
    lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    decidedAt: { type: DataTypes.DATE, allowNull: true },
    ...stamps
  })
  await qi.addIndex('profile_versions', ['profileId', 'versionNo'], { unique: true })
  await qi.addIndex('profile_versions', ['workshopId', 'state'])
  await qi.sequelize.query(`
    ALTER TABLE profile_versions ADD CONSTRAINT profile_versions_state CHECK (state IN ('draft', 'in-review', 'approved', 'rejected', 'signed-off', 'superseded', 'withdrawn'));
    ALTER TABLE profile_versions ADD CONSTRAINT profile_versions_origin CHECK (origin IN ('workshop', 'roadside'));
    ALTER TABLE profile_versions ADD CONSTRAINT profile_versions_number CHECK ("versionNo" >= 1);
    ALTER TABLE profiles ADD CONSTRAINT profiles_on_car FOREIGN KEY ("onCarVersionId") REFERENCES profile_versions(id);

    CREATE FUNCTION profile_versions_next_number() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE expected integer;
    BEGIN
      PERFORM 1 FROM profiles WHERE id = NEW."profileId" FOR UPDATE;
      SELECT coalesce(max("versionNo"), 0) + 1 INTO expected FROM profile_versions WHERE "profileId" = NEW."profileId";
      IF NEW."versionNo" IS DISTINCT FROM expected THEN
        RAISE EXCEPTION 'version number % would leave a gap or a duplicate (next is %)', NEW."versionNo", expected USING ERRCODE = 'check_violation';
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER profile_versions_numbering BEFORE INSERT ON profile_versions
      FOR EACH ROW EXECUTE FUNCTION profile_versions_next_number();

    CREATE FUNCTION profile_versions_freeze() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' THEN
        RAISE EXCEPTION 'profile versions are never deleted' USING ERRCODE = 'insufficient_privilege';
      END IF;
      IF OLD.state <> 'draft' AND (NEW.parameters IS DISTINCT FROM OLD.parameters OR NEW.rationale IS DISTINCT FROM OLD.rationale
          OR NEW."contentHash" IS DISTINCT FROM OLD."contentHash" OR NEW."versionNo" IS DISTINCT FROM OLD."versionNo"
          OR NEW."profileId" IS DISTINCT FROM OLD."profileId" OR NEW."authorId" IS DISTINCT FROM OLD."authorId"
          OR NEW.evaluation IS DISTINCT FROM OLD.evaluation) THEN
        RAISE EXCEPTION 'version % has left draft: its content cannot change', OLD.id USING ERRCODE = 'insufficient_privilege';
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER profile_versions_frozen BEFORE UPDATE OR DELETE ON profile_versions
      FOR EACH ROW EXECUTE FUNCTION profile_versions_freeze();
  `)
  await qi.createTable('reviews', {
    id,
    workshopId: ref('workshops'),
    versionId: ref('profile_versions'),
    reviewerId: ref('users'),
    decision: { type: DataTypes.TEXT, allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
  })
  await qi.addIndex('reviews', ['versionId'])
  await qi.sequelize.query(`ALTER TABLE reviews ADD CONSTRAINT reviews_decision CHECK (decision IN ('approve', 'reject'))`)
  await qi.createTable('mail_outbox', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    workshopId: ref('workshops', true),
    to: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: true },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastError: { type: DataTypes.TEXT, allowNull: true },
    nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
    sentAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') }
  })
  await qi.addIndex('mail_outbox', ['state', 'nextAttemptAt'])
  await qi.sequelize.query(`ALTER TABLE mail_outbox ADD CONSTRAINT mail_outbox_state CHECK (state IN ('pending', 'sent', 'failed'))`)
}

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('mail_outbox')
  await qi.dropTable('reviews')
  await qi.sequelize.query('ALTER TABLE profiles DROP CONSTRAINT profiles_on_car')
  await qi.dropTable('profile_versions')
  await qi.dropTable('profiles')
  await qi.sequelize.query('DROP FUNCTION IF EXISTS profile_versions_next_number(); DROP FUNCTION IF EXISTS profile_versions_freeze();')
}
