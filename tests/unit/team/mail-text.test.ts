// @vitest-environment node
import { describe, expect, it } from 'vitest'
import { decodeWords, parseMail } from '../../../server/mail/mime.ts'
import { escapeHtml, html } from '../../../server/mail/templates/escape.ts'

describe('escaping user text for HTML mail', () => {
  it('escapes the five special characters', () => {
    expect(escapeHtml(`<a href="x">Tom & Jo's</a>`)).toBe(
      '&lt;a href=&quot;x&quot;&gt;Tom &amp; Jo&#39;s&lt;/a&gt;',
    )
  })
  it('escapes every value of the html template tag, not the template itself', () => {
    expect(html`<b>${'<i>'}</b>${3}`).toBe('<b>&lt;i&gt;</b>3')
  })
})

describe('reading captured MIME messages', () => {
  it('decodes encoded-word headers, joined across whitespace', () => {
    expect(decodeWords('=?UTF-8?Q?Pr=C3=BCfung?= =?UTF-8?B?IOKAlCBvaw==?=')).toBe('Prüfung — ok')
  })

  it('finds the text and HTML parts of a nested multipart message', () => {
    const raw = [
      'From: Tributary <no-reply@tributary.example.test>',
      'Subject: Hello',
      'Content-Type: multipart/mixed; boundary="outer"',
      '',
      '--outer',
      'Content-Type: multipart/alternative; boundary=inner',
      '',
      '--inner',
      'Content-Type: text/plain; charset=utf-8',
      'Content-Transfer-Encoding: quoted-printable',
      '',
      'Zo=C3=AB=E2=80=99s washroom, a long line that is wrapped by a soft line =',
      'break.',
      '--inner',
      'Content-Type: text/html; charset=utf-8',
      'Content-Transfer-Encoding: base64',
      '',
      Buffer.from('<p>Zoë</p>').toString('base64'),
      '--inner--',
      '--outer--',
      '',
    ].join('\r\n')
    expect(parseMail(Buffer.from(raw, 'utf8').toString('latin1'))).toEqual({
      from: 'Tributary <no-reply@tributary.example.test>',
      subject: 'Hello',
      text: 'Zoë’s washroom, a long line that is wrapped by a soft line break.',
      html: '<p>Zoë</p>',
    })
  })
})
