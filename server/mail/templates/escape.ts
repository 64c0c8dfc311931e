const ENTITIES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
}

/** Makes user text (names, project names) safe inside HTML text and attribute values. */
export const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (ch) => ENTITIES[ch]!)

/** Tagged template that escapes every interpolated value. */
export function html(strings: TemplateStringsArray, ...values: (string | number)[]): string {
  return strings.reduce(
    (out, s, i) => out + s + (i < values.length ? escapeHtml(String(values[i])) : ''),
    '',
  )
}
