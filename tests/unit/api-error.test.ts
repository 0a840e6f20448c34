import { describe, expect, it } from 'vitest'
import { apiError, errorMessage } from '../../app/utils/api-error'
import { internalNameIn } from './internal-names'

// The shape ofetch gives a refusal: the server's {statusCode, message, data} under `data`.
const refusal = (message: string, fields?: { path: string, message: string }[]) => ({ statusCode: 400, data: { statusCode: 400, message, data: fields ? { fields } : undefined } })

describe('a refusal as the screens say it', () => {
  it('a refusal by field reads in the fields\' own messages, never their paths', () => {
    const e = refusal('Please check: spec.kerbMassKg (At least 300 kg); parameters.powerCapKw (At most 110)', [
      { path: 'spec.kerbMassKg', message: 'At least 300 kg' }, { path: 'parameters.powerCapKw', message: 'At most 110' }, { path: 'spec.year', message: 'At least 300 kg' }
    ])
    const said = errorMessage(e, 'fallback')
    expect(said).toBe('Some values need a look: At least 300 kg; At most 110.')
    expect(internalNameIn(said)).toBeUndefined()
    expect(apiError(e).data?.fields).toHaveLength(3) // each field still finds its own input
  })

  it('any other refusal keeps the server\'s own words, and a network failure the screen\'s', () => {
    expect(errorMessage(refusal('This version was changed by someone else meanwhile.'), 'fallback')).toBe('This version was changed by someone else meanwhile.')
    expect(errorMessage(new TypeError('fetch failed'), 'The change could not be saved.')).toBe('The change could not be saved.')
  })
})
