import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import type { Permission } from '@shared/domain/access'
import { prefetchBoard } from '@/api/board'
import { i18n } from '@/i18n'
import { useLocaleStore } from '@/stores/locale'
import { useSessionStore } from '@/stores/session'

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean
    /** A page for the public (the owner's page): no staff top bar, even for someone signed in. */
    bare?: boolean
    /** The permission (shared/domain/access/permissions.ts) a role needs to open this page. */
    permission?: Permission
    /** Shown in the top bar's navigation with this label (a catalog key). */
    nav?: string
    /** A page visited now and then (records, administration): at a desk it sits in the menu with the person, not in the bar. */
    navMore?: boolean
    /** The page's title (a catalog key). */
    title?: string
    /** Starts the page's data loading as soon as the route is allowed. */
    prefetch?: () => void
  }
}

export const routes: RouteRecordRaw[] = [
  // Home is each role's landing page (homeOf), chosen in the guard once the session is known.
  { path: '/', name: 'home', component: { render: () => null } },
  { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { public: true, title: 'signIn.pageTitle' } },
  // A fresh install without the demo (no company yet): the first manager sets it up (the sign-in page sends them here).
  { path: '/first-run', name: 'first-run', component: () => import('@/views/FirstRunView.vue'), meta: { public: true, bare: true, title: 'firstRun.pageTitle' } },
  { path: '/today', name: 'today', component: () => import('@/views/TodayView.vue'), meta: { permission: 'board.view', nav: 'today.nav', title: 'today.pageTitle' } },
  { path: '/board', name: 'board', component: () => import('@/views/BoardView.vue'), meta: { permission: 'board.view', nav: 'shell.nav.board', title: 'shell.titles.board', prefetch: prefetchBoard } },
  { path: '/archive', name: 'archive', component: () => import('@/views/ArchiveView.vue'), meta: { navMore: true, permission: 'board.view', nav: 'shell.nav.archive', title: 'shell.titles.archive' } },
  { path: '/tow-in', name: 'tow-in', component: () => import('@/views/TowInView.vue'), meta: { permission: 'towin.write', nav: 'shell.nav.towIn', title: 'shell.titles.towIn' } },
  { path: '/vehicles/:vehicleId', name: 'vehicle', component: () => import('@/views/VehicleView.vue'), meta: { permission: 'board.view', title: 'shell.titles.vehicle' } },
  { path: '/vehicles/:vehicleId/inspection', name: 'inspection', component: () => import('@/views/InspectionView.vue'), meta: { permission: 'board.view', title: 'shell.titles.inspection' } },
  { path: '/cash-drawer', name: 'cash-drawer', component: () => import('@/views/CashDrawerView.vue'), meta: { permission: 'billing.write', nav: 'billing.drawer.nav', title: 'billing.drawer.title' } },
  { path: '/deadlines', name: 'deadlines', component: () => import('@/views/DeadlinesView.vue'), meta: { permission: 'deadlines', nav: 'deadlines.nav', title: 'deadlines.pageTitle' } },
  // The office's reports (issue 12): one link in the bar, the reports' own tabs between them.
  { path: '/reports', redirect: '/reports/receivables' },
  { path: '/reports/receivables', name: 'receivables', component: () => import('@/views/ReceivablesView.vue'), meta: { permission: 'reports', nav: 'reports.nav', title: 'reports.receivables.title' } },
  { path: '/reports/aged', name: 'aged', component: () => import('@/views/AgedInventoryView.vue'), meta: { permission: 'reports', title: 'reports.aged.title' } },
  { path: '/reports/salvage', name: 'salvage', component: () => import('@/views/SalvageInventoryView.vue'), meta: { permission: 'reports', title: 'reports.salvage.title' } },
  { path: '/reports/daily', name: 'daily', component: () => import('@/views/DailyReportView.vue'), meta: { permission: 'reports', title: 'reports.daily.title' } },
  { path: '/reports/glance', name: 'glance', component: () => import('@/views/YardGlanceView.vue'), meta: { permission: 'admin', title: 'glance.title' } },
  // The gate's phone: a pass scanned or typed; /g/<token> is where a pass's QR leads a phone's own camera.
  { path: '/gate', name: 'gate', component: () => import('@/views/GateView.vue'), meta: { permission: 'release.write', nav: 'shell.nav.gate', title: 'shell.titles.gate' } },
  { path: '/g/:token', name: 'gate-pass', component: () => import('@/views/GateView.vue'), meta: { permission: 'release.write', title: 'shell.titles.gate' } },
  { path: '/outbox', name: 'outbox', component: () => import('@/views/OutboxView.vue'), meta: { navMore: true, permission: 'outbox', nav: 'shell.nav.outbox', title: 'shell.titles.outbox' } },
  // The owner's page (no account): its key is a link's token or the short code from a letter.
  { path: '/o', name: 'owner-start', component: () => import('@/views/OwnerStartView.vue'), meta: { public: true, bare: true, title: 'shell.titles.owner' } },
  { path: '/o/payment-return', name: 'owner-payment-return', component: () => import('@/views/OwnerPaymentReturnView.vue'), meta: { public: true, bare: true, title: 'shell.titles.owner' } },
  { path: '/o/:key', name: 'owner', component: () => import('@/views/OwnerView.vue'), meta: { public: true, bare: true, title: 'shell.titles.owner' } },
  { path: '/settings', name: 'settings', component: () => import('@/views/SettingsView.vue'), meta: { navMore: true, permission: 'admin', nav: 'settings.nav', title: 'settings.title' } },
  { path: '/settings/rule-sets/:ruleSetId', name: 'settings-rule-set', component: () => import('@/views/RuleSetEditorView.vue'), meta: { permission: 'admin', title: 'settings.ruleSets.title' } },
  { path: '/settings/yards', name: 'settings-yards', component: () => import('@/views/YardSettingsView.vue'), meta: { permission: 'admin', title: 'yards.settings.title' } },
  { path: '/settings/audit', name: 'settings-audit', component: () => import('@/views/SettingsAuditView.vue'), meta: { permission: 'admin', title: 'settings.audit.title' } },
  { path: '/users', name: 'users', component: () => import('@/views/UsersView.vue'), meta: { navMore: true, permission: 'admin', nav: 'shell.nav.users', title: 'shell.titles.users' } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { public: true, title: 'shell.titles.notFound' } },
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
  if (to.name === 'sign-in' && session.signedIn) return { path: typeof to.query.next === 'string' ? to.query.next : homeOf(session.user?.role) }
  if (to.meta.public) return true
  if (!session.signedIn) return { name: 'sign-in', query: to.path === '/' ? {} : { next: to.fullPath } }
  if (to.path === '/') return { path: homeOf(session.user?.role) }
  if (to.meta.permission && !session.allows(to.meta.permission)) return { name: 'board' }
  to.meta.prefetch?.()
  return true
})

// A lazy route component is a function returning its module; the router imports it again later
// and gets the same module from the browser's cache.
function loadComponent(component: unknown) {
  if (typeof component === 'function' && component.length === 0) return (component as () => Promise<unknown>)().catch(() => undefined)
}

/** Where each role lands (issue 12): the office and managers on Today, the yard's hands on the board. */
export function homeOf(role: string | undefined): string {
  return role === 'office' || role === 'manager' ? '/today' : '/board'
}

router.afterEach((to) => {
  document.title = to.meta.title ? `${i18n.global.t(to.meta.title)} · Holdfast` : 'Holdfast'
})
