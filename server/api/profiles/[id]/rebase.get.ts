// What moving a car profile onto its kit's newer baseline would keep, take and leave to choose.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const user = await requirePermission(event, 'staff')
  return previewRebase(user, id)
})
