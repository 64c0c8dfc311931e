/** Pure helpers of the comment composer: @mention suggestions and the ids a text still mentions. */

export interface Mentionable {
  userId: string
  name: string
}

/** The partial `@word` being typed at the end of `text`, or null. */
export function mentionQuery(text: string): string | null {
  const match = /(?:^|\s)@([^\s@]{0,40})$/.exec(text)
  return match ? match[1]! : null
}

/** Members whose name starts with (or has a word starting with) the query, at most `limit`. */
export function suggest(people: readonly Mentionable[], query: string, limit = 6): Mentionable[] {
  const q = query.toLowerCase()
  return people
    .filter(
      (p) =>
        p.name
          .toLowerCase()
          .split(/\s+/)
          .some((word) => word.startsWith(q)) || p.name.toLowerCase().startsWith(q),
    )
    .slice(0, limit)
}

/** `text` with the trailing partial mention replaced by `@Full Name `. */
export function insertMention(text: string, person: Mentionable): string {
  return text.replace(/@([^\s@]{0,40})$/, `@${person.name} `)
}

/** The picked people whose `@Name` is still in the text (a deleted mention mails nobody). */
export function mentionedIds(text: string, picked: readonly Mentionable[]): string[] {
  return [...new Set(picked.filter((p) => text.includes(`@${p.name}`)).map((p) => p.userId))]
}
