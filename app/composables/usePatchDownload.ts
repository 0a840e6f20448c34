// Saves an RFC 6902 patch as a file (the screens show the change as a table, the patch is for tools).
export function downloadPatch(patch: unknown[], filename: string) {
  const blob = new Blob([`${JSON.stringify(patch, null, 2)}\n`], { type: 'application/json-patch+json' })
  const link = document.createElement('a')
  link.href = URL.createObjectURL(blob)
  link.download = filename
  link.click()
  URL.revokeObjectURL(link.href)
}
