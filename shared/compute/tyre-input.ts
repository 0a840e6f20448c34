// The car's tyres as evaluation needs them: front, rear and the driven axle's, with errors.
import type { VehicleSpec } from '../schemas/vehicle-spec'
import { parseTyreSize, type TyreSize } from './tyres'
import type { EvaluationError } from './types'

export interface CarTyres {
  front: TyreSize | null
  rear: TyreSize | null
  driven: TyreSize | null
}

export function readTyres(spec: VehicleSpec): { tyres: CarTyres, errors: EvaluationError[] } {
  const errors: EvaluationError[] = []
  const read = (field: 'tyreSize' | 'tyreSizeFront' | 'tyreSizeRear'): TyreSize | null => {
    const result = parseTyreSize(spec[field])
    if (result.ok) return result.tyre
    errors.push({ path: `spec.${field}`, message: result.message })
    return null
  }
  const common = read('tyreSize')
  const front = spec.tyreSizeFront !== undefined ? read('tyreSizeFront') : common
  const rear = spec.tyreSizeRear !== undefined ? read('tyreSizeRear') : common
  // The driven axle's tyre sets the gearing; all-wheel drive goes by the rear.
  return { tyres: { front, rear, driven: spec.drivenAxle === 'front' ? front : rear }, errors }
}
