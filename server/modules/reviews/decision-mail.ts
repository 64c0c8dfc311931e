import type { OutgoingMail } from '../../mail/mailer.ts'
import { html } from '../../mail/templates/escape.ts'
import { htmlButton, htmlLayout } from '../../mail/templates/layout.ts'

export interface ReviewDecisionMailInput {
  to: string
  reviewerName: string
  projectName: string
  diagramName: string
  decision: 'approved' | 'changes_requested'
  revision: number
  note: string
  link: string
}

/** A reviewer's decision, to the project's editors; the note is escaped in the HTML. */
export function reviewDecisionMail(input: ReviewDecisionMailInput): OutgoingMail {
  const verb = input.decision === 'approved' ? 'approved' : 'requested changes to'
  const subject = `${input.reviewerName} ${verb} ${input.diagramName} (${input.projectName})`
  const text = [
    `${input.reviewerName} ${verb} "${input.diagramName}" at revision ${input.revision} ` +
      `in the project "${input.projectName}".`,
    ...(input.note ? ['', 'Note:', ...input.note.split('\n').map((line) => `> ${line}`)] : []),
    '',
    `Open the diagram: ${input.link}`,
  ].join('\n')
  const note = input.note
    ? html`<blockquote
        style="margin:12px 0;padding:8px 12px;border-left:3px solid #d9dde0;white-space:pre-wrap"
      >
        ${input.note}
      </blockquote>`
    : ''
  const body =
    html`<p>
      <strong>${input.reviewerName}</strong> ${verb} <strong>${input.diagramName}</strong> at
      revision ${input.revision} in the project <strong>${input.projectName}</strong>.
    </p>` +
    note +
    htmlButton(input.link, 'Open the diagram')
  return { to: input.to, subject, text, html: htmlLayout(subject, body) }
}
