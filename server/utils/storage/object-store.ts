// Object storage through the AWS SDK: S3 in production, s3rver on loopback in development and tests.
import { randomUUID } from 'node:crypto'
import type { Readable } from 'node:stream'
import { S3Client, GetObjectCommand, DeleteObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3'
import { Upload } from '@aws-sdk/lib-storage'

let client: S3Client | undefined

export function objectStore(): S3Client {
  if (client) return client
  const config = useRuntimeConfig()
  client = new S3Client({
    endpoint: config.s3Endpoint,
    region: config.s3Region,
    forcePathStyle: true,
    // s3rver knows one key pair, S3RVER/S3RVER; production sets real ones (NUXT_S3_ACCESS_KEY_ID, NUXT_S3_SECRET_ACCESS_KEY).
    credentials: { accessKeyId: config.s3AccessKeyId || 'S3RVER', secretAccessKey: config.s3SecretAccessKey || 'S3RVER' },
    // Without these the SDK frames streamed bodies with checksums that s3rver stores verbatim, corrupting the file.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    // A store that hangs must not hold a request for ever: give up on a silent connection or socket.
    requestHandler: { connectionTimeout: 5000, requestTimeout: 30000 }
  })
  // Every failure of the store is marked as the store's, so the error handler can tell it from the database's
  // (added once, with the client).
  client.middlewareStack.add(next => async (args) => {
    try {
      return await next(args)
    } catch (e) {
      if (e && typeof e === 'object') Object.assign(e, { objectStore: true })
      throw e
    }
  }, { step: 'initialize', name: 'voltwrightMarkObjectStoreErrors' })
  return client
}

const bucket = () => useRuntimeConfig().s3Bucket

// Random, so an object's address says nothing about the car or the record it belongs to.
export function newObjectKey(kind: 'telemetry' | 'photo' | 'thumbnail'): string {
  return `${kind}/${randomUUID()}`
}

// A streamed upload in parts; the caller may abort it (nothing is left behind when it does).
export function startObjectUpload(key: string, body: Readable, contentType: string): Upload {
  return new Upload({ client: objectStore(), params: { Bucket: bucket(), Key: key, Body: body, ContentType: contentType }, queueSize: 2, partSize: 8 * 1024 * 1024 })
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await objectStore().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }))
}

export async function getObjectStream(key: string): Promise<{ body: Readable, contentLength: number | undefined }> {
  const res = await objectStore().send(new GetObjectCommand({ Bucket: bucket(), Key: key }))
  return { body: res.Body as Readable, contentLength: res.ContentLength }
}


// Best effort: a failed clean-up is logged, never allowed to hide the error that caused it.
export async function deleteObjects(keys: (string | null | undefined)[]): Promise<void> {
  await Promise.all(keys.filter((k): k is string => Boolean(k)).map(key =>
    objectStore().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }))
      .catch(e => console.error(`[storage] could not delete ${key}: ${(e as Error).message}`))))
}
