import { describe, expect, it } from 'vitest'
import { signInBodySchema, signUpBodySchema } from '../../../shared/api/schemas'

describe('API body schemas', () => {
  it('normalises e-mail addresses (trim, lower case)', () => {
    const body = signInBodySchema.parse({ email: '  Avery@Example.TEST ', password: 'x' })
    expect(body.email).toBe('avery@example.test')
  })

  it.each([
    [{ email: 'a@example.test', name: 'A', password: '123456789' }, 'password'],
    [{ email: 'nope', name: 'A', password: '1234567890' }, 'email'],
    [{ email: 'a@example.test', name: ' ', password: '1234567890' }, 'name'],
  ])('rejects %j naming %s', (body, field) => {
    const parsed = signUpBodySchema.safeParse(body)
    expect(parsed.success).toBe(false)
    expect(parsed.error?.issues[0]?.path).toEqual([field])
  })
})
