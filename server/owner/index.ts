export { ownerRouter, type OwnerRouterDeps } from './owner.routes'
export { ownerLinksRouter } from './owner-links.routes'
export { lookupRouter } from './lookup.routes'
export { DEFAULT_PUBLIC_LIMITS, publicThrottle, type PublicLimits } from './public-throttle'
