import type { OutgoingMail } from '../mailer.ts'
import { html } from './escape.ts'
import { htmlButton, htmlLayout, mailDate } from './layout.ts'

/** The "choose a new password" message, plain text and HTML. */
export function passwordResetMail(input: {
  to: string
  name: string
  link: string
  expiresAt: Date
}): OutgoingMail {
  const subject = 'Choose a new Tributary password'
  const expires = mailDate(input.expiresAt)
  const text = [
    `Hello ${input.name},`,
    '',
    'Someone (we hope you) asked to reset the password of your Tributary account.',
    '',
    `Choose a new password: ${input.link}`,
    '',
    `The link works once and expires on ${expires}. Choosing a new password signs your account`,
    'out everywhere else. If you did not ask for this, ignore this e-mail: your password stays.',
  ].join('\n')
  const body =
    html`<p>Hello ${input.name},</p>
      <p>Someone (we hope you) asked to reset the password of your Tributary account.</p>` +
    htmlButton(input.link, 'Choose a new password') +
    html`<p style="font-size:13px;color:#5b6770">
      The link works once and expires on ${expires}. Choosing a new password signs your account out
      everywhere else. If you did not ask for this, ignore this e-mail: your password stays.
    </p>`
  return { to: input.to, subject, text, html: htmlLayout(subject, body) }
}
