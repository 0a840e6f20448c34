// A kit's baseline and where each car profile stands on it (docs/kits.md).
import type { Transaction } from 'sequelize'
import { Kit, Profile, ProfileVersion } from '../../models'
import type { ProfileBaseline } from '../../../shared/schemas/profile-views'
import { settingsThatDiffer } from '../../../shared/utils/three-way'

// The version a profile's work stands on: the newest one not withdrawn or sent back, else the newest.
export function currentVersion<V extends Pick<ProfileVersion, 'versionNo' | 'state'>>(versions: V[]): V | undefined {
  const newest = [...versions].sort((a, b) => b.versionNo - a.versionNo)
  return newest.find(v => v.state !== 'withdrawn' && v.state !== 'rejected') ?? newest[0]
}

// The newest approved version of a kit's baseline: what cars booked in now start from.
export async function latestApprovedBaseline(baselineProfileId: number, transaction?: Transaction) {
  return ProfileVersion.findOne({ where: { profileId: baselineProfileId, state: 'approved' }, order: [['versionNo', 'DESC']], transaction })
}

// For each car profile built from a kit: its baseline version, the settings that differ, and whether it moved.
export async function profileBaselines(profiles: (Profile & { versions?: ProfileVersion[] })[]): Promise<Map<number, ProfileBaseline>> {
  const current = new Map(profiles.map(p => [p.id, currentVersion(p.versions ?? [])]))
  const ids = [...new Set([...current.values()].map(v => v?.baselineVersionId).filter((id): id is number => !!id))]
  const out = new Map<number, ProfileBaseline>()
  if (!ids.length) return out
  const baseVersions = await ProfileVersion.findAll({ where: { id: ids }, include: [{ model: Profile, as: 'profile', include: [{ model: Kit, as: 'kit' }] }] })
  const profileIds = [...new Set(baseVersions.map(b => b.profileId))]
  const approved = await ProfileVersion.findAll({ where: { profileId: profileIds, state: 'approved' }, attributes: ['id', 'versionNo', 'profileId'], order: [['versionNo', 'DESC']] })
  for (const p of profiles) {
    const v = current.get(p.id)
    const base = baseVersions.find(b => b.id === v?.baselineVersionId)
    const kit = (base?.profile as (Profile & { kit?: Kit }) | undefined)?.kit
    if (!v || !base || !kit) continue
    const newest = approved.find(l => l.profileId === base.profileId)
    out.set(p.id, {
      kitId: kit.id, kitName: kit.name, versionId: base.id, versionNo: base.versionNo, currentVersionId: v.id,
      differs: settingsThatDiffer(base.parameters, v.parameters),
      moved: newest && newest.versionNo > base.versionNo ? { versionId: newest.id, versionNo: newest.versionNo } : null
    })
  }
  return out
}
