import type { OutgoingMail } from '../mailer.ts'
import { html } from './escape.ts'
import { htmlButton, htmlLayout, mailDate } from './layout.ts'

export interface InvitationMailInput {
  to: string
  inviterName: string
  projectName: string
  organisationName: string
  role: string
  link: string
  expiresAt: Date
}

const ROLE_MEANING: Record<string, string> = {
  owner: 'manage the project and its members',
  editor: 'draw and change the riser diagrams',
  reviewer: 'check the diagrams and record review comments',
  viewer: 'look at the diagrams and their results',
}

/** "X invited you to project Y": plain text and HTML, user text escaped in the HTML. */
export function invitationMail(input: InvitationMailInput): OutgoingMail {
  const meaning = ROLE_MEANING[input.role] ?? 'take part'
  const expires = mailDate(input.expiresAt)
  const subject = `${input.inviterName} invited you to ${input.projectName} on Tributary`
  const text = [
    'Hello,',
    '',
    `${input.inviterName} (${input.organisationName}) invited you to the project ` +
      `"${input.projectName}" on Tributary as ${article(input.role)} ${input.role}: ` +
      `you will be able to ${meaning}.`,
    '',
    `Accept the invitation: ${input.link}`,
    '',
    `The link works once and expires on ${expires}.`,
    'If you did not expect this invitation, you can ignore this e-mail.',
  ].join('\n')
  const body =
    html`<p>Hello,</p>
      <p>
        <strong>${input.inviterName}</strong> (${input.organisationName}) invited you to the project
        <strong>${input.projectName}</strong> on Tributary as ${article(input.role)}
        <strong>${input.role}</strong>: you will be able to ${meaning}.
      </p>` +
    htmlButton(input.link, 'Accept the invitation') +
    html`<p style="font-size:13px;color:#5b6770">
      The link works once and expires on ${expires}. If you did not expect this invitation, you can
      ignore this e-mail.
    </p>`
  return { to: input.to, subject, text, html: htmlLayout(subject, body) }
}

const article = (word: string) => (/^[aeiou]/i.test(word) ? 'an' : 'a')
