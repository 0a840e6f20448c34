// What a photo upload takes, for the server's check and the phone's, so a refusal is explained before it is sent.
export const PHOTO_MAX_MB = 15
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const

// Why a chosen file would be refused, in the tester's words; null when it will do.
export function photoProblem(file: { name: string, type: string, size: number }): string | null {
  if (!(PHOTO_TYPES as readonly string[]).includes(file.type)) return `${file.name} was not added: only JPEG, PNG or WebP photos are taken.`
  if (file.size > PHOTO_MAX_MB * 1024 * 1024) return `${file.name} was not added: it is ${(file.size / 1024 / 1024).toFixed(1)} MB, and a photo may be at most ${PHOTO_MAX_MB} MB.`
  return null
}
