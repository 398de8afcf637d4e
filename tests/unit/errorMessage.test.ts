import { describe, expect, it } from 'vitest'
import { errorMessage } from '../../composables/useWrite'

// Shapes of a failed $fetch (ofetch's FetchError) as server/error.ts answers: the JSON body is in
// `data`, with `message` for a person; a network failure has only the error's own message.
describe('the message of a failed request', () => {
  it('prefers the message the server wrote for a person', () => {
    const e = { statusCode: 400, statusMessage: 'Bad Request', message: '[PUT] "/api/places/3": 400', data: { message: 'lat: must be between -90 and 90' } }
    expect(errorMessage(e, 'not saved')).toBe('lat: must be between -90 and 90')
  })

  it('falls back to the status message, then the error message, then the caller\'s words', () => {
    expect(errorMessage({ data: { statusMessage: 'Plan not found' }, statusMessage: 'Not Found' })).toBe('Plan not found')
    expect(errorMessage({ statusMessage: 'Service Unavailable' })).toBe('Service Unavailable')
    expect(errorMessage(new TypeError('fetch failed'))).toBe('fetch failed')
    expect(errorMessage({ data: { message: '' } }, 'The change was not saved')).toBe('The change was not saved')
    expect(errorMessage(null, 'The change was not saved')).toBe('The change was not saved')
  })
})
