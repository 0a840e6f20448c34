export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { vehicle } = await requireVehicle(event, id)
  const sheet = await handoverSheet(vehicle)
  const pdf = await renderHandoverPdf(sheet)
  setResponseHeaders(event, {
    'content-type': 'application/pdf',
    'content-disposition': `attachment; filename="handover-${vehicle.stockRef.replace(/[^\w-]/g, '_')}.pdf"`,
    'cache-control': 'private, no-store'
  })
  return pdf
})
