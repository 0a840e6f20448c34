import { createStore, del, entries, get, set, type UseStore } from 'idb-keyval'

// Photos taken in the road-test wizard, kept in the phone's IndexedDB until the server has them, so a reload,
// a closed tab or a lost signal loses none (docs/road-tests.md#no-signal). Each is tied to the person who took
// it, the version and the record's send key: it is only ever sent with that record.
export interface KeptPhoto { id: string, owner: number, versionId: number, sendKey: string, name: string, type: string, blob: Blob }
// What the draft holds of a photo: `kept` false when the phone would not store it (private browsing, full
// storage), so it lives in this page only; `tried` once a send of it began (its answer may have been lost).
export interface PhotoRef { id: string, name: string, bytes: number, kept: boolean, tried?: boolean }

let store: UseStore | null = null
const photoStore = () => (store ??= createStore('voltwright-road-tests', 'photos'))
const inPage = new Map<string, KeptPhoto>()

export async function keepPhoto(photo: Omit<KeptPhoto, 'id'>): Promise<PhotoRef> {
  const kept: KeptPhoto = { ...photo, id: crypto.randomUUID() }
  inPage.set(kept.id, kept)
  const stored = await set(kept.id, kept, photoStore()).then(() => true, () => false)
  return { id: kept.id, name: photo.name, bytes: photo.blob.size, kept: stored }
}

export async function readPhoto(id: string): Promise<KeptPhoto | null> {
  return inPage.get(id) ?? await get<KeptPhoto>(id, photoStore()).catch(() => undefined) ?? null
}

export async function dropPhoto(id: string) {
  inPage.delete(id)
  await del(id, photoStore()).catch(() => {})
}

// Drops this person's photos of a version that belong to no record in hand: left from a draft that was forgotten.
export async function dropStrayPhotos(owner: number, versionId: number, sendKey: string) {
  const all = await entries<string, KeptPhoto>(photoStore()).catch(() => [])
  await Promise.all(all.filter(([, p]) => p.owner === owner && p.versionId === versionId && p.sendKey !== sendKey).map(([id]) => dropPhoto(id)))
}

export async function sha256Hex(blob: Blob): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', await blob.arrayBuffer())
  return [...new Uint8Array(digest)].map(b => b.toString(16).padStart(2, '0')).join('')
}
