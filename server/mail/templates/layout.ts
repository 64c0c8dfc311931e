import { html } from './escape.ts'

/** The HTML frame around every message; `body` must already be escaped. */
export function htmlLayout(title: string, body: string): string {
  return `<!doctype html>
<html><head><meta charset="utf-8"><title>${html`${title}`}</title></head>
<body style="margin:0;padding:24px;background:#f6f7f5;font-family:Arial,Helvetica,sans-serif;color:#23323d">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d9dde0;border-radius:6px;padding:28px">
<p style="margin:0 0 18px;font-weight:bold;color:#17405e;letter-spacing:0.02em">Tributary</p>
${body}
</div></body></html>`
}

/** A link styled as a button, with the address repeated for clients that hide buttons. */
export function htmlButton(href: string, label: string): string {
  return html`<p style="margin:22px 0">
      <a
        href="${href}"
        style="display:inline-block;background:#17405e;color:#ffffff;text-decoration:none;padding:10px 18px;border-radius:4px;font-weight:bold"
        >${label}</a
      >
    </p>
    <p style="font-size:13px;color:#5b6770">
      Or paste this address into your browser:<br /><a
        href="${href}"
        style="color:#17405e;word-break:break-all"
        >${href}</a
      >
    </p>`
}

/** Dates in e-mail are written out in UTC so every reader sees the same moment. */
export const mailDate = (date: Date) =>
  date.toLocaleString('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' }) + ' UTC'
