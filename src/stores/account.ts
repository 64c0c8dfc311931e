import type { Account, ChangePasswordBody, UpdateAccountBody } from '@shared/api/account'
import type { InvitationSignUpBody } from '@shared/api/invitations'
import type { CapturedMail } from '@shared/api/mail'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import * as api from '@/api/account'
import * as invitations from '@/api/invitations'
import * as mail from '@/api/mail'
import { useAuthStore } from './auth'

/** The user's own settings, password flows and (in development) the captured-mail box. */
export const useAccountStore = defineStore('account', () => {
  const account = ref<Account | null>(null)
  const mailboxAvailable = ref(false)
  const mailbox = ref<CapturedMail[]>([])
  const auth = useAuthStore()

  async function fetch() {
    account.value = await api.fetchAccount()
    return account.value
  }

  /** Saves settings and mirrors name, colour and units into the signed-in user. */
  async function update(body: UpdateAccountBody) {
    const saved = await api.updateAccount(body)
    account.value = saved
    if (auth.user)
      auth.user = { ...auth.user, name: saved.name, color: saved.color, units: saved.units }
    return saved
  }

  const changePassword = (body: ChangePasswordBody) => api.changePassword(body)
  const requestReset = (email: string) => api.requestPasswordReset(email)
  const previewReset = (token: string) => api.previewPasswordReset(token)
  const completeReset = (token: string, password: string) =>
    api.completePasswordReset(token, password)
  const previewInvitation = (token: string) => invitations.previewInvitation(token)

  /** Creates the account from an invitation; the new person is signed in and on the project. */
  async function signUpFromInvitation(body: InvitationSignUpBody) {
    const { user, ...joined } = await invitations.signUpFromInvitation(body)
    auth.$patch({ user, hydrated: true })
    return joined
  }

  async function checkMailbox() {
    mailboxAvailable.value = auth.signedIn ? await mail.mailboxAccess().catch(() => false) : false
  }

  async function fetchMailbox() {
    mailbox.value = await mail.listCapturedMail()
  }

  function dehydrate() {
    account.value = null
    mailboxAvailable.value = false
    mailbox.value = []
  }

  return {
    account,
    mailboxAvailable,
    mailbox,
    fetch,
    update,
    changePassword,
    requestReset,
    previewReset,
    completeReset,
    previewInvitation,
    signUpFromInvitation,
    checkMailbox,
    fetchMailbox,
    dehydrate,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useAccountStore, import.meta.hot))
