import { QueryClient } from '@tanstack/vue-query'

/** The one cache of server data; routes may start a page's first fetch before the page has loaded. */
export const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: 5_000, retry: 1 } } })
