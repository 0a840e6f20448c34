// What a version's hash covers and what its evaluation snapshot keeps; plain functions, shared with the demo seeder.
import type { Evaluation } from '../../../shared/compute/types'
import type { EvaluationSnapshot } from '../../../shared/schemas/profile-views'
import type { VersionOrigin } from '../../../shared/schemas/version'
import { canonicalJson } from '../../../shared/utils/canonical-json'
import { sha256Hex } from '../history/audit'

export interface VersionContent {
  profileId: number
  versionNo: number
  parentVersionId: number | null
  parameters: Record<string, number>
  rationale: string
  authorId: number
  origin: VersionOrigin
}

// SHA-256 of the canonical JSON of the version's content (docs/architecture.md#version-hash), never of its state or review.
export function versionContentHash(c: VersionContent): string {
  return sha256Hex(canonicalJson({
    profileId: c.profileId, versionNo: c.versionNo, parentVersionId: c.parentVersionId ?? null,
    parameters: c.parameters, rationale: c.rationale, authorId: c.authorId, origin: c.origin
  }))
}

// The evaluation the reviewer is shown, kept when the version leaves draft (curves are recomputed on demand).
export function snapshotOf(e: Evaluation, at = new Date()): EvaluationSnapshot {
  return { valid: e.valid, errors: e.errors, warnings: e.warnings, figures: e.figures, nullReasons: e.nullReasons, evaluatedAt: at.toISOString() }
}
