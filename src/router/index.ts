import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import type { Permission } from '@shared/domain/access'
import { prefetchBoard } from '@/api/board'
import { useLocaleStore } from '@/stores/locale'
import { useSessionStore } from '@/stores/session'

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean
    /** The permission (shared/domain/access/permissions.ts) a role needs to open this page. */
    permission?: Permission
    /** Shown in the top bar's navigation with this label. */
    nav?: string
    title?: string
    /** Starts the page's data loading as soon as the route is allowed. */
    prefetch?: () => void
  }
}

export const routes: RouteRecordRaw[] = [
  { path: '/', redirect: '/board' },
  { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { public: true, title: 'Sign in' } },
  { path: '/board', name: 'board', component: () => import('@/views/BoardView.vue'), meta: { permission: 'board.view', nav: 'Board', title: 'Board', prefetch: prefetchBoard } },
  { path: '/archive', name: 'archive', component: () => import('@/views/ArchiveView.vue'), meta: { permission: 'board.view', nav: 'Archive', title: 'Archive' } },
  { path: '/tow-in', name: 'tow-in', component: () => import('@/views/TowInView.vue'), meta: { permission: 'towin.write', nav: 'Log a tow-in', title: 'Log a tow-in' } },
  { path: '/vehicles/:vehicleId', name: 'vehicle', component: () => import('@/views/VehicleView.vue'), meta: { permission: 'board.view', title: 'Vehicle' } },
  { path: '/vehicles/:vehicleId/inspection', name: 'inspection', component: () => import('@/views/InspectionView.vue'), meta: { permission: 'board.view', title: 'Teardown' } },
  { path: '/users', name: 'users', component: () => import('@/views/UsersView.vue'), meta: { permission: 'admin', nav: 'Staff', title: 'Staff' } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { public: true, title: 'Not found' } },
]

export const router = createRouter({
  history: createWebHistory(),
  routes,
  // Back and forward return to where the page was; a new page opens at its top (or at its anchor,
  // clear of the sticky top bar), not at the last page's scroll position.
  scrollBehavior(to, from, saved) {
    if (saved) return saved
    if (to.hash) return { el: to.hash, top: 64 }
    // Filters and paging written into the query keep the same page where it is.
    if (to.path === from.path) return false
    return { top: 0 }
  },
})

router.beforeEach(async (to) => {
  const session = useSessionStore()
  if (!session.loaded) {
    // First visit: fetch the page's code while the session is checked, not after.
    for (const record of to.matched) void loadComponent(record.components?.default)
    await session.load()
  }
  // Every page but sign-in needs the whole catalog of the chosen language.
  if (to.name !== 'sign-in') await useLocaleStore().ready()
  if (to.name === 'sign-in' && session.signedIn) return { path: typeof to.query.next === 'string' ? to.query.next : '/board' }
  if (to.meta.public) return true
  if (!session.signedIn) return { name: 'sign-in', query: { next: to.fullPath } }
  if (to.meta.permission && !session.allows(to.meta.permission)) return { name: 'board' }
  to.meta.prefetch?.()
  return true
})

// A lazy route component is a function returning its module; the router imports it again later
// and gets the same module from the browser's cache.
function loadComponent(component: unknown) {
  if (typeof component === 'function' && component.length === 0) return (component as () => Promise<unknown>)().catch(() => undefined)
}

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Holdfast` : 'Holdfast'
})
