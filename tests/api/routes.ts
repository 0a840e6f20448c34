// Every route file under server/api, read from the disk, so a new route is walked without anyone listing it.
import { readdirSync } from 'node:fs'
import { join, relative, resolve } from 'node:path'

export const apiDir = resolve(import.meta.dirname, '..', '..', 'server', 'api')

// file: 'versions/[id]/diff/[other].get.ts'; segments: ['versions', '[id]', 'diff', '[other]'].
export interface Route { file: string, method: string, segments: string[] }

export function routeFiles(dir = apiDir): Route[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((d) => {
    const full = join(dir, d.name)
    if (d.isDirectory()) return routeFiles(full)
    const m = /^(.*)\.(get|post|patch|put|delete)\.ts$/.exec(d.name)
    if (!m) return []
    const rel = relative(apiDir, full)
    const segments = [...relative(apiDir, dir).split('/').filter(Boolean), ...(m[1] === 'index' ? [] : [m[1]!])]
    return [{ file: rel, method: m[2]!.toUpperCase(), segments }]
  }).sort((a, b) => a.file.localeCompare(b.file))
}

// The URL of a route with each `[param]` filled by `fill(param name, segment before it)`.
export function routeUrl(r: Route, fill: (param: string, before: string) => string): string {
  return `/api/${r.segments.map((s, i) => {
    const m = /^\[(.+)\]$/.exec(s)
    return m ? encodeURIComponent(fill(m[1]!, r.segments[i - 1] ?? '')) : s
  }).join('/')}`
}
