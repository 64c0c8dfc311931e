import { expect, test } from '@playwright/test'
import { InvitationPage } from './pages/invitation.page'
import { MailboxPage } from './pages/mailbox.page'
import { MembersPage } from './pages/members.page'
import { SignInPage } from './pages/sign-in.page'

const PROJECT = 'Fernhollow Community Hall'

test('the owner invites a reviewer, who opens the e-mail, joins and sees the project', async ({
  browser,
}) => {
  const reviewerEmail = `reviewer-${Date.now()}@example.test`
  const owner = await browser.newPage()
  const consoleErrors: string[] = []
  owner.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()))

  await owner.goto('/sign-in')
  await new SignInPage(owner).signIn('avery@example.test')
  await expect(owner).toHaveURL(/\/projects$/)

  const members = new MembersPage(owner)
  await members.open(PROJECT)
  await members.invite(reviewerEmail, 'reviewer')
  await owner.screenshot({ path: 'test-results/screens/members.png' })

  const mailbox = new MailboxPage(owner)
  await mailbox.open()
  const link = await mailbox.linkInMessageTo(reviewerEmail)
  expect(link).toMatch(/\/invitations\/[A-Za-z0-9_-]{43}$/)
  await expect(owner.getByTestId('mailbox-message')).toContainText(
    'invited you to Fernhollow Community Hall',
  )
  await owner.screenshot({ path: 'test-results/screens/mailbox.png' })

  // The reviewer follows the link in a browser of their own.
  const context = await browser.newContext()
  const reviewer = await context.newPage()
  await reviewer.goto(new URL(link).pathname)
  const invitation = new InvitationPage(reviewer)
  await invitation.expectFor(reviewerEmail, 'reviewer')
  await reviewer.screenshot({ path: 'test-results/screens/invitation.png' })
  await invitation.createAccount('Robin Vasquez-Hale', 'reviewer passphrase')
  await expect(reviewer).toHaveURL(/\/projects\/[0-9a-f-]{36}$/)
  await expect(reviewer.locator('h1')).toHaveText(PROJECT)
  await expect(reviewer.getByTestId('role-reviewer').first()).toBeVisible()
  await expect(reviewer.getByTestId('new-diagram')).toHaveCount(0)

  // The link works once.
  await reviewer.goto(new URL(link).pathname)
  await invitation.expectProblem('already been used')
  await reviewer.screenshot({ path: 'test-results/screens/invitation-used.png' })
  await context.close()

  // The owner sees the new member and the activity entries.
  await members.open(PROJECT)
  await expect(members.row(reviewerEmail)).toContainText('Robin Vasquez-Hale')
  await owner.getByTestId('tab-activity').click()
  await expect(owner.getByTestId('activity-list')).toContainText(
    'Robin Vasquez-Hale accepted the invitation and joined as reviewer',
  )
  await expect(owner.getByTestId('activity-list')).toContainText(
    `Avery Lindqvist invited ${reviewerEmail} as reviewer`,
  )
  await owner.screenshot({ path: 'test-results/screens/activity.png' })
  // The first /api/auth/me before sign-in answers 401 by design.
  expect(consoleErrors.filter((e) => !e.includes('401'))).toEqual([])
})
