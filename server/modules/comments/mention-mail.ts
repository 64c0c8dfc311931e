import type { OutgoingMail } from '../../mail/mailer.ts'
import { html } from '../../mail/templates/escape.ts'
import { htmlButton, htmlLayout } from '../../mail/templates/layout.ts'

export interface MentionMailInput {
  to: string
  authorName: string
  projectName: string
  diagramName: string
  body: string
  link: string
}

/** "X mentioned you in a comment": plain text and HTML, the comment text escaped in the HTML. */
export function mentionMail(input: MentionMailInput): OutgoingMail {
  const subject = `${input.authorName} mentioned you on ${input.diagramName} (${input.projectName})`
  const text = [
    `${input.authorName} mentioned you in a comment on "${input.diagramName}" ` +
      `in the project "${input.projectName}":`,
    '',
    ...input.body.split('\n').map((line) => `> ${line}`),
    '',
    `Open the diagram: ${input.link}`,
  ].join('\n')
  const body =
    html`<p>
        <strong>${input.authorName}</strong> mentioned you in a comment on
        <strong>${input.diagramName}</strong> in the project <strong>${input.projectName}</strong>:
      </p>
      <blockquote
        style="margin:12px 0;padding:8px 12px;border-left:3px solid #d9dde0;white-space:pre-wrap"
      >
        ${input.body}
      </blockquote>` + htmlButton(input.link, 'Open the diagram')
  return { to: input.to, subject, text, html: htmlLayout(subject, body) }
}
