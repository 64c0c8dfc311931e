import { createRouter, createWebHistory } from 'vue-router'
import { useAuthStore } from '@/stores/auth'

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    { path: '/', redirect: '/projects' },
    { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { public: true } },
    { path: '/sign-up', name: 'sign-up', component: () => import('@/views/SignUpView.vue'), meta: { public: true } },
    {
      path: '/',
      component: () => import('@/layouts/AppLayout.vue'),
      children: [
        { path: 'projects', name: 'projects', component: () => import('@/views/ProjectListView.vue') },
        {
          path: 'projects/:projectId/diagrams/:diagramId',
          name: 'editor',
          component: () => import('@/views/DiagramEditorView.vue'),
          props: true,
        },
        {
          path: 'projects/:projectId',
          name: 'project',
          component: () => import('@/views/ProjectView.vue'),
          props: true,
        },
      ],
    },
    { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { public: true } },
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
