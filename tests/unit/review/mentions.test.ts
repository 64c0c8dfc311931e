import { describe, expect, it } from 'vitest'
import { insertMention, mentionedIds, mentionQuery, suggest } from '@/features/review/mentions'

const people = [
  { userId: 'u1', name: 'Blake Designer' },
  { userId: 'u2', name: 'Casey Reviewer' },
  { userId: 'u3', name: 'Casimir Owner' },
]

describe('@mention helpers', () => {
  it('finds the partial mention at the end of the text only', () => {
    expect(mentionQuery('Hello @Ca')).toBe('Ca')
    expect(mentionQuery('@')).toBe('')
    expect(mentionQuery('mail me at a@b')).toBeNull()
    expect(mentionQuery('Hello @Casey done')).toBeNull()
  })

  it('suggests members by the start of any word of their name', () => {
    expect(suggest(people, 'cas').map((p) => p.userId)).toEqual(['u2', 'u3'])
    expect(suggest(people, 'rev').map((p) => p.userId)).toEqual(['u2'])
    expect(suggest(people, '', 2)).toHaveLength(2)
  })

  it('inserts the full name and keeps only mentions still in the text', () => {
    const text = insertMention('Please check @ca', people[1]!)
    expect(text).toBe('Please check @Casey Reviewer ')
    expect(mentionedIds(text, [people[1]!, people[0]!])).toEqual(['u2'])
    expect(mentionedIds('no mention left', [people[1]!])).toEqual([])
  })
})
