import { createRouter, createWebHistory } from 'vue-router'
import { useAuthStore } from '@/stores/auth'

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    { path: '/', redirect: '/projects' },
    {
      path: '/sign-in',
      name: 'sign-in',
      component: () => import('@/views/SignInView.vue'),
      meta: { public: true },
    },
    {
      path: '/sign-up',
      name: 'sign-up',
      component: () => import('@/views/SignUpView.vue'),
      meta: { public: true },
    },
    {
      path: '/forgot-password',
      name: 'forgot-password',
      component: () => import('@/views/ForgotPasswordView.vue'),
      meta: { public: true },
    },
    {
      path: '/reset-password/:token',
      name: 'reset-password',
      component: () => import('@/views/ResetPasswordView.vue'),
      props: true,
      meta: { public: true },
    },
    {
      path: '/invitations/:token',
      name: 'invitation',
      component: () => import('@/views/InvitationView.vue'),
      props: true,
      meta: { public: true },
    },
    {
      path: '/',
      component: () => import('@/layouts/AppLayout.vue'),
      children: [
        {
          path: 'projects',
          name: 'projects',
          component: () => import('@/views/ProjectListView.vue'),
        },
        {
          path: 'projects/:projectId/diagrams/:diagramId',
          name: 'editor',
          component: () => import('@/views/DiagramEditorView.vue'),
          props: true,
        },
        {
          path: 'projects/:projectId/members',
          name: 'project-members',
          component: () => import('@/views/ProjectMembersView.vue'),
          props: true,
        },
        {
          path: 'projects/:projectId/activity',
          name: 'project-activity',
          component: () => import('@/views/ProjectActivityView.vue'),
          props: true,
        },
        { path: 'account', name: 'account', component: () => import('@/views/AccountView.vue') },
        {
          path: 'organisations',
          name: 'organisations',
          component: () => import('@/views/OrganisationView.vue'),
        },
        {
          path: 'dev/mailbox',
          name: 'mailbox',
          component: () => import('@/views/DevMailboxView.vue'),
        },
        {
          path: 'projects/:projectId',
          name: 'project',
          component: () => import('@/views/ProjectView.vue'),
          props: true,
        },
      ],
    },
    {
      path: '/:pathMatch(.*)*',
      name: 'not-found',
      component: () => import('@/views/NotFoundView.vue'),
      meta: { public: true },
    },
  ],
})

// Auth guard: private pages need a session; signed-in users skip the sign-in page.
router.beforeEach(async (to) => {
  const auth = useAuthStore()
  await auth.hydrate()
  if (!to.meta.public && !auth.signedIn) {
    return { name: 'sign-in', query: to.fullPath !== '/projects' ? { next: to.fullPath } : {} }
  }
  if ((to.name === 'sign-in' || to.name === 'sign-up') && auth.signedIn) return { name: 'projects' }
})
