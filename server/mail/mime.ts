/**
 * Just enough MIME reading for the local fake SMTP server to show captured messages: headers
 * with encoded words, nested multipart bodies, quoted-printable and base64 parts.
 */
export interface ParsedMail {
  from: string
  subject: string
  text: string
  html: string
}

interface Part {
  headers: Map<string, string>
  body: string
}

/** `raw` is the message as latin1 text, one character per byte, so any charset can be decoded. */
export function parseMail(raw: string): ParsedMail {
  const root = splitPart(raw)
  const found = { text: '', html: '' }
  collectBodies(root, found)
  return {
    from: decodeWords(root.headers.get('from') ?? ''),
    subject: decodeWords(root.headers.get('subject') ?? ''),
    ...found,
  }
}

function splitPart(raw: string): Part {
  const gap = raw.search(/\r?\n\r?\n/)
  const head = gap < 0 ? raw : raw.slice(0, gap)
  const body = gap < 0 ? '' : raw.slice(gap).replace(/^\r?\n\r?\n/, '')
  const headers = new Map<string, string>()
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':')
    if (colon > 0)
      headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim())
  }
  return { headers, body }
}

function param(header: string, name: string): string | undefined {
  const match = new RegExp(`${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i').exec(header)
  return match ? (match[1] ?? match[2]) : undefined
}

function collectBodies(part: Part, found: { text: string; html: string }) {
  const type = part.headers.get('content-type') ?? 'text/plain'
  const mediaType = type.split(';')[0]!.trim().toLowerCase()
  if (mediaType.startsWith('multipart/')) {
    const boundary = param(type, 'boundary')
    if (!boundary) return
    const pieces = part.body.split(`--${boundary}`).slice(1)
    for (const piece of pieces) {
      if (piece.startsWith('--')) break
      collectBodies(splitPart(piece.replace(/^\r?\n/, '')), found)
    }
    return
  }
  if (mediaType !== 'text/plain' && mediaType !== 'text/html') return
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase()
  const decoded = decodeBytes(toBytes(part.body, encoding), param(type, 'charset') ?? 'utf-8')
  if (mediaType === 'text/plain' && !found.text)
    found.text = decoded.replace(/\r\n/g, '\n').trimEnd()
  if (mediaType === 'text/html' && !found.html)
    found.html = decoded.replace(/\r\n/g, '\n').trimEnd()
}

function toBytes(body: string, encoding: string): Buffer {
  if (encoding === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64')
  if (encoding === 'quoted-printable') return fromQuotedPrintable(body)
  return Buffer.from(body, 'latin1')
}

function fromQuotedPrintable(text: string): Buffer {
  const unwrapped = text.replace(/=\r?\n/g, '')
  const bytes: number[] = []
  for (let i = 0; i < unwrapped.length; i++) {
    const hex = unwrapped.slice(i + 1, i + 3)
    if (unwrapped[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16))
      i += 2
    } else {
      bytes.push(unwrapped.charCodeAt(i) & 0xff)
    }
  }
  return Buffer.from(bytes)
}

function decodeBytes(bytes: Buffer, charset: string): string {
  try {
    return new TextDecoder(charset).decode(bytes)
  } catch {
    return bytes.toString('utf8')
  }
}

/** RFC 2047 encoded words (`=?UTF-8?Q?...?=`); whitespace between two of them is dropped. */
export function decodeWords(value: string): string {
  // Raw 8-bit header text (read as latin1) is taken to be UTF-8.
  const text = /[^ -~\t]/.test(value) ? decodeBytes(Buffer.from(value, 'latin1'), 'utf-8') : value
  return text
    .replace(/(\?=)\s+(=\?)/g, '$1$2')
    .replace(
      /=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g,
      (_all, charset: string, kind: string, data: string) => {
        const bytes =
          kind.toUpperCase() === 'B'
            ? Buffer.from(data, 'base64')
            : fromQuotedPrintable(data.replace(/_/g, ' '))
        return decodeBytes(bytes, charset)
      },
    )
}
