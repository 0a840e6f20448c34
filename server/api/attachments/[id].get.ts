import { z } from 'zod'
import { Attachment } from '../../models'

const querySchema = z.object({ size: z.enum(['full', 'thumbnail']).default('full') })

// A stored file, for staff of the workshop it belongs to; the object key never leaves the server.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { size } = await getValidatedQuery(event, zodValidator(querySchema))
  const user = await requirePermission(event, 'staff')
  const a = await Attachment.findOne({ where: { id, workshopId: user.workshopId } })
  if (!a) throw createError({ statusCode: 404, message: 'No such file in this workshop.' })
  const thumb = size === 'thumbnail' && a.thumbnailKey
  const { body, contentLength } = await getObjectStream(thumb ? a.thumbnailKey! : a.objectKey)
  setResponseHeaders(event, {
    'content-type': thumb ? 'image/jpeg' : a.contentType,
    'content-disposition': contentDisposition(a.contentType.startsWith('image/') ? 'inline' : 'attachment', a.filename),
    'cache-control': 'private, max-age=3600',
    'x-content-type-options': 'nosniff',
    ...(contentLength ? { 'content-length': contentLength } : {})
  })
  return sendStream(event, body)
})
