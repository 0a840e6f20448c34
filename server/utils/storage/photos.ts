// Photos for road-test checks and snags: type and size checked, the image itself read by sharp (so a
// renamed file is caught), a thumbnail made, both stored under random keys.
import { createHash } from 'node:crypto'
import type { H3Event } from 'h3'
import sharp from 'sharp'
import { Attachment } from '../../models'
import type { SignedIn } from '../guards/guards'
import { megabytes, receiveUpload, tooLarge, UploadRefused } from './uploads'
import { useDatabase } from '../database/db'
import { appendAuditEvent } from '../history/audit'
import { newObjectKey, putObject, deleteObjects } from './object-store'
import { PHOTO_MAX_MB } from '../../../shared/schemas/photo'

export const PHOTO_MAX_BYTES = megabytes(PHOTO_MAX_MB)
export const THUMBNAIL_PX = 320
const FORMATS: Record<string, string> = { 'image/jpeg': 'jpeg', 'image/png': 'png', 'image/webp': 'webp' }

export interface PhotoOwner { ownerType: 'road-test' | 'snag', ownerId: number, vehicleId: number, caption: string }

async function readImage(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const parts: Buffer[] = []
  let size = 0
  for await (const chunk of stream as AsyncIterable<Buffer>) {
    size += chunk.length
    if (size > PHOTO_MAX_BYTES) throw tooLarge(PHOTO_MAX_BYTES)
    parts.push(chunk)
  }
  return Buffer.concat(parts)
}

export async function makeThumbnail(image: Buffer): Promise<Buffer> {
  return sharp(image).rotate().resize(THUMBNAIL_PX, THUMBNAIL_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 78 }).toBuffer()
}

export async function uploadPhoto(event: H3Event, user: SignedIn, owner: PhotoOwner) {
  return receiveUpload(event, { field: 'file', maxBytes: PHOTO_MAX_BYTES }, async (file) => {
    const expected = FORMATS[file.mimeType]
    if (!expected) throw new UploadRefused(415, `Photos must be JPEG, PNG or WebP images, not ${file.mimeType || 'a file of no stated type'}.`)
    const image = await readImage(file.stream)
    // sharp throws outright (not a rejected promise) on an empty buffer.
    if (!image.length) throw new UploadRefused(400, 'The photo is empty.', { fields: [{ path: 'file', message: 'The file is empty' }] })
    const meta = await sharp(image).metadata().catch(() => null)
    if (!meta || meta.format !== expected) throw new UploadRefused(415, `The file is not the ${expected.toUpperCase()} image it says it is.`)
    const thumbnail = await makeThumbnail(image)
    const key = newObjectKey('photo')
    const thumbKey = newObjectKey('thumbnail')
    await Promise.all([putObject(key, image, file.mimeType), putObject(thumbKey, thumbnail, 'image/jpeg')])
    try {
      return await useDatabase().transaction(async (transaction) => {
        const a = await Attachment.create({
          workshopId: user.workshopId, ownerType: owner.ownerType, ownerId: owner.ownerId, objectKey: key, thumbnailKey: thumbKey,
          filename: file.filename.slice(0, 200) || `photo.${expected}`, contentType: file.mimeType, bytes: image.length,
          sha256: createHash('sha256').update(image).digest('hex'), uploadedBy: user.id, caption: owner.caption
        }, { transaction })
        await appendAuditEvent(transaction, {
          workshopId: user.workshopId, vehicleId: owner.vehicleId, actorId: user.id, action: owner.ownerType === 'snag' ? 'snag.photo-added' : 'road-test.photo-added', entityType: owner.ownerType, entityId: owner.ownerId,
          data: { attachmentId: a.id, filename: a.filename, bytes: a.bytes, sha256: a.sha256, caption: owner.caption, width: meta.width, height: meta.height }
        })
        return { ...attachmentView(a), width: meta.width, height: meta.height }
      })
    } catch (e) {
      await deleteObjects([key, thumbKey])
      throw e
    }
  })
}
