import { expect, test } from '@playwright/test'
import { ReviewPage } from './pages/review.page'
import { DEMO_PASSWORD } from './pages/sign-in.page'
import { copyDemoDiagram } from './demo-copy'

const EDITOR = 'blake@example.test'
const REVIEWER = 'casey@example.test'
type Named = { id: string; name: string }

const cleanup: (() => Promise<void>)[] = []
test.afterEach(async () => {
  for (const step of cleanup.splice(0)) await step()
})

test('a reviewer pins a comment on a pipe, the designer sees it live and resolves it, the reviewer approves', async ({
  browser,
}) => {
  const blake = await ReviewPage.signedIn(browser, EDITOR)
  const casey = await ReviewPage.signedIn(browser, REVIEWER)

  // A copy of the demo diagram, so other journeys keep the seeded one as it is.
  const api = blake.page.request
  const { path, remove } = await copyDemoDiagram(api)
  cleanup.push(async () => {
    await remove()
    await blake.close()
    await casey.close()
  })
  const me = (await (await api.get('/api/auth/me')).json()) as { user: Named }

  await blake.open(path)
  await casey.open(path)
  await expect(casey.status()).toHaveText('Not yet submitted for review')
  await expect(casey.page.getByTestId('review-submit')).toHaveCount(0)

  // The designer submits; the reviewer's bar changes live.
  await blake.page.getByTestId('review-submit').click()
  await expect(blake.status()).toContainText('Submitted for review at revision')
  await expect(casey.status()).toContainText('Submitted for review at revision')

  // The reviewer pins a comment on a pipe and mentions the designer. Markup stays text.
  await casey.selectPipe('c-core')
  await casey.openComments()
  await casey.comment('Is <b>this</b> main big enough for both floors?', {
    typed: 'Bla',
    userId: me.user.id,
  })
  await expect(casey.thread()).toBeVisible()
  await expect(casey.thread().getByTestId('comment-body')).toHaveText(
    `Is <b>this</b> main big enough for both floors? @${me.user.name}`,
  )
  await expect(casey.pin('c-core')).toHaveText('1')

  // The designer sees the pin arrive without reloading, opens it and resolves it.
  await expect(blake.pin('c-core')).toHaveText('1')
  await expect(blake.page.getByTestId('comments-tab')).toContainText('1')
  await blake.page.screenshot({ path: 'test-results/screens/review-pin-designer.png' })
  await blake.pin('c-core').click()
  await expect(blake.thread().getByTestId('comment-body')).toContainText('main big enough')
  await expect(blake.thread().locator('b')).toHaveCount(0)
  await blake.page.screenshot({ path: 'test-results/screens/review-thread-designer.png' })
  await blake.thread().getByTestId('thread-resolve').click()
  await expect(blake.thread().getByTestId('thread-resolved')).toBeVisible()

  // Resolved reaches the reviewer live: the thread is marked and its pin leaves the canvas.
  await expect(casey.thread().getByTestId('thread-resolved')).toBeVisible()
  await expect(casey.pin('c-core')).toHaveCount(0)

  // The reviewer approves; both bars say so, tied to the revision.
  await casey.page.getByTestId('review-approve').click()
  await expect(casey.status()).toContainText('Approved at revision')
  await expect(blake.status()).toContainText('Approved at revision')
  await casey.page.screenshot({ path: 'test-results/screens/review-approved-reviewer.png' })
  await casey.page.getByTestId('thread-back').click()
  await casey.page.getByTestId('show-resolved').click()
  await expect(casey.page.getByTestId('thread-item')).toHaveCount(1)
  await expect(casey.pin('c-core')).toHaveText('1')
  await casey.page.screenshot({ path: 'test-results/screens/review-list-reviewer.png' })

  // An edit after approval: the badge reads "changed since approval" for both.
  await blake.page.getByTestId('comments-tab').click()
  await blake.selectNode('j-u-men')
  await blake.page.getByTestId('palette-item-lavatory').click()
  await expect(blake.status()).toContainText('Changed since approval')
  await expect(casey.status()).toContainText('Changed since approval')
  await blake.page.screenshot({ path: 'test-results/screens/review-changed-designer.png' })

  // The mention reached the designer by e-mail (read by the organisation admin in the dev mailbox).
  const admin = await browser.newContext()
  cleanup.push(() => admin.close())
  const signIn = await admin.request.post('/api/auth/sign-in', {
    data: { email: 'avery@example.test', password: DEMO_PASSWORD },
  })
  expect(signIn.ok()).toBe(true)
  const mail = await admin.request.get(`/api/dev/mail?to=${EDITOR}`)
  expect(mail.ok()).toBe(true)
  expect(JSON.stringify(await mail.json())).toContain(
    'Casey Marchetti mentioned you on Domestic water',
  )
})
